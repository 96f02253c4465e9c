import { useId, type ReactNode } from 'react';
import type { Role } from '../../shared/roles';
import type { AnalyticsMeta } from '../../shared/schemas/analytics';
import type { AnalyticsFilterParams } from '../../shared/schemas/analytics-filters';
import { SUBGROUP_KEYS } from '../../shared/schemas/analytics-subgroups';
import { NARROW_OPTIONS, SUBGROUP_LABELS } from '../features/analytics/labels';

type Changes = Partial<Record<keyof AnalyticsFilterParams, string | undefined>>;

type Props = {
  filters: AnalyticsFilterParams;
  onChange: (changes: Changes) => void;
  /** Options (instruments, conditions, clinics) from the last answer; the bar waits for them. */
  options: AnalyticsMeta['options'] | undefined;
  role: Role;
  /** Which controls this screen offers beyond period, condition and instrument. */
  show?: { clinic?: boolean; groupBy?: boolean; narrow?: boolean };
  busy?: boolean;
};

const iso = (d: Date) => d.toISOString().slice(0, 10);

/** Period presets: rolling windows ending today, and the last four calendar years. */
function periodPresets(today = new Date()) {
  const back = (months: number) => {
    const d = new Date(today);
    d.setMonth(d.getMonth() - months);
    return iso(d);
  };
  const year = today.getFullYear();
  return [
    { key: 'all', label: 'All time', from: undefined, to: undefined },
    { key: '12m', label: 'Last 12 months', from: back(12), to: iso(today) },
    { key: '24m', label: 'Last 24 months', from: back(24), to: iso(today) },
    ...[0, 1, 2, 3].map((k) => ({
      key: String(year - k),
      label: `Started in ${year - k}`,
      from: `${year - k}-01-01`,
      to: `${year - k}-12-31`,
    })),
  ];
}

const control = 'rounded border border-line bg-surface px-2 py-1.5 text-sm text-ink disabled:opacity-60';

function Field({ label, children }: { label: string; children: (id: string) => ReactNode }) {
  const id = useId();
  return (
    <div className="flex min-w-36 flex-col gap-1">
      <label htmlFor={id} className="text-xs text-ink-soft">
        {label}
      </label>
      {children(id)}
    </div>
  );
}

/** The one filter bar of the outcome dashboards; every change goes into the URL (see useFilterParams). */
export function FilterBar({ filters, onChange, options, role, show = {}, busy }: Props) {
  const presets = periodPresets();
  const preset = presets.find((p) => p.from === filters.from && p.to === filters.to)?.key ?? 'custom';
  const clinicRole = role === 'lead' || role === 'clinician';
  const waiting = options === undefined;
  return (
    <form
      role="search"
      aria-label="Filters"
      aria-busy={busy}
      className="flex flex-wrap items-end gap-4 rounded border border-line bg-surface px-4 py-3"
      onSubmit={(e) => e.preventDefault()}
    >
      <Field label="Period (start of care)">
        {(id) => (
          <select
            id={id}
            className={control}
            value={preset}
            onChange={(e) => {
              const p = presets.find((x) => x.key === e.target.value);
              if (p) onChange({ from: p.from, to: p.to });
              else onChange({ from: filters.from ?? presets[1]!.from, to: filters.to ?? presets[1]!.to });
            }}
          >
            {presets.map((p) => (
              <option key={p.key} value={p.key}>
                {p.label}
              </option>
            ))}
            <option value="custom">Chosen dates…</option>
          </select>
        )}
      </Field>
      {preset === 'custom' ? (
        <>
          <Field label="From">
            {(id) => (
              <input
                id={id}
                type="date"
                className={control}
                value={filters.from ?? ''}
                onChange={(e) => onChange({ from: e.target.value })}
              />
            )}
          </Field>
          <Field label="To">
            {(id) => (
              <input
                id={id}
                type="date"
                className={control}
                value={filters.to ?? ''}
                onChange={(e) => onChange({ to: e.target.value })}
              />
            )}
          </Field>
        </>
      ) : null}
      <Field label="Condition">
        {(id) => (
          <select
            id={id}
            className={control}
            disabled={waiting}
            value={filters.condition ?? ''}
            onChange={(e) => onChange({ condition: e.target.value })}
          >
            <option value="">All conditions</option>
            {options?.conditions.map((c) => (
              <option key={c.code} value={c.code}>
                {c.label}
              </option>
            ))}
          </select>
        )}
      </Field>
      <Field label="Instrument (responders and change)">
        {(id) => (
          <select
            id={id}
            className={control}
            disabled={waiting}
            value={filters.instrument ?? 'nprs-first-step'}
            onChange={(e) => onChange({ instrument: e.target.value })}
          >
            {(
              options?.instruments ?? [
                { code: 'nprs-first-step', label: 'Pain on first steps in the morning (0–10)', hasMcid: true },
              ]
            ).map((i) => (
              <option key={i.code} value={i.code}>
                {i.label}
                {i.hasMcid ? '' : ' (no MCID)'}
              </option>
            ))}
          </select>
        )}
      </Field>
      {show.clinic && role === 'steward' ? (
        <Field label="Clinic">
          {(id) => (
            <select
              id={id}
              className={control}
              disabled={waiting}
              value={filters.clinic ?? ''}
              onChange={(e) => onChange({ clinic: e.target.value })}
            >
              <option value="">Whole registry</option>
              {options?.clinics.map((c) => (
                <option key={c.id} value={String(c.id)}>
                  {c.code} · {c.name}
                  {c.active ? '' : ' (inactive)'}
                </option>
              ))}
            </select>
          )}
        </Field>
      ) : null}
      {show.clinic && clinicRole ? (
        <Field label="Episodes of">
          {(id) => (
            <select
              id={id}
              className={control}
              value={filters.clinic === 'registry' ? 'registry' : ''}
              onChange={(e) => onChange({ clinic: e.target.value })}
            >
              <option value="">My clinic</option>
              <option value="registry">Whole registry</option>
            </select>
          )}
        </Field>
      ) : null}
      {show.groupBy ? (
        <Field label="Compare by">
          {(id) => (
            <select
              id={id}
              className={control}
              value={filters.groupBy ?? 'activity'}
              onChange={(e) => onChange({ groupBy: e.target.value })}
            >
              {SUBGROUP_KEYS.map((k) => (
                <option key={k} value={k}>
                  {SUBGROUP_LABELS[k]}
                </option>
              ))}
            </select>
          )}
        </Field>
      ) : null}
      {show.narrow !== false ? (
        <Field label="Only episodes of">
          {(id) => (
            <select
              id={id}
              className={control}
              value={filters.subgroup && filters.level ? `${filters.subgroup}:${filters.level}` : ''}
              onChange={(e) => {
                const [subgroup, level] = e.target.value ? e.target.value.split(':') : [undefined, undefined];
                onChange({ subgroup, level });
              }}
            >
              <option value="">Every subgroup</option>
              {NARROW_OPTIONS.map((g) => (
                <optgroup key={g.key} label={g.label}>
                  {g.levels.map((l) => (
                    <option key={l.level} value={`${g.key}:${l.level}`}>
                      {l.label}
                    </option>
                  ))}
                </optgroup>
              ))}
            </select>
          )}
        </Field>
      ) : null}
      {busy ? (
        <p role="status" className="pb-1.5 text-xs text-ink-faint">
          Updating…
        </p>
      ) : null}
    </form>
  );
}
