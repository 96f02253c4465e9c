import { useState, type FormEvent } from 'react';
import { InterventionsPutSchema, type EpisodeDetail } from '../../../../shared/schemas/episode';
import type { InterventionInfo } from '../../../../shared/schemas/reference';
import { ErrorNotice } from '../../../components/error-notice';
import { inputClass } from '../../../components/form-field';
import { useSetInterventions } from '../api/set-interventions';

type Row = { on: boolean; startWeek: string; maxLevel: string };
const KIND_WORDS = { core: 'Core programme', addon: 'Add-ons' } as const;

function initialRows(episode: EpisodeDetail, codes: InterventionInfo[]): Record<string, Row> {
  const rows: Record<string, Row> = {};
  for (const c of codes) {
    const got = episode.interventions.find((i) => i.code === c.code);
    rows[c.code] = {
      on: Boolean(got),
      startWeek: String(got?.startWeek ?? 0),
      maxLevel: got?.maxLevel ? String(got.maxLevel) : '',
    };
  }
  return rows;
}

/** What the episode receives: the full list is saved at once (it replaces the recorded one). */
export function InterventionsForm({ episode, codes }: { episode: EpisodeDetail; codes: InterventionInfo[] }) {
  const save = useSetInterventions(episode.id);
  const [rows, setRows] = useState(() => initialRows(episode, codes));
  const [problem, setProblem] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const change = (code: string, patch: Partial<Row>) => {
    setSaved(false);
    setRows((r) => ({ ...r, [code]: { ...r[code]!, ...patch } }));
  };

  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    const chosen = codes.filter((c) => rows[c.code]?.on);
    const parsed = InterventionsPutSchema.safeParse({
      interventions: chosen.map((c) => ({
        code: c.code,
        startWeek: Number(rows[c.code]!.startWeek || 0),
        maxLevel: c.graded && rows[c.code]!.maxLevel ? Number(rows[c.code]!.maxLevel) : null,
      })),
    });
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      const code = typeof issue?.path[1] === 'number' ? chosen[issue.path[1]]?.label : undefined;
      setProblem(`${code ? `${code}: ` : ''}the starting week must be a whole number from 0 to 104`);
      return;
    }
    setProblem(null);
    save.mutate(parsed.data, { onSuccess: () => setSaved(true) });
  };

  return (
    <form noValidate onSubmit={onSubmit} aria-label="Interventions" className="space-y-5">
      {(['core', 'addon'] as const).map((kind) => (
        <fieldset key={kind} className="space-y-2">
          <legend className="text-sm font-medium">{KIND_WORDS[kind]}</legend>
          {codes
            .filter((c) => c.kind === kind)
            .map((c) => {
              const row = rows[c.code]!;
              return (
                <div key={c.code} className="flex flex-wrap items-center gap-x-4 gap-y-2">
                  <label className="flex w-72 items-center gap-2 text-sm">
                    <input
                      type="checkbox"
                      checked={row.on}
                      onChange={(e) => change(c.code, { on: e.target.checked })}
                      className="accent-accent"
                    />
                    {c.label}
                  </label>
                  {row.on ? (
                    <>
                      <label className="flex items-center gap-2 text-xs text-ink-soft">
                        from week
                        <input
                          type="number"
                          min={0}
                          max={104}
                          aria-label={`${c.label}: from week`}
                          value={row.startWeek}
                          onChange={(e) => change(c.code, { startWeek: e.target.value })}
                          className={`${inputClass} w-20`}
                        />
                      </label>
                      {c.graded ? (
                        <label className="flex items-center gap-2 text-xs text-ink-soft">
                          highest level reached
                          <select
                            aria-label={`${c.label}: highest level reached`}
                            value={row.maxLevel}
                            onChange={(e) => change(c.code, { maxLevel: e.target.value })}
                            className={`${inputClass} w-24`}
                          >
                            <option value="">not yet</option>
                            <option value="1">1</option>
                            <option value="2">2</option>
                            <option value="3">3</option>
                          </select>
                        </label>
                      ) : null}
                    </>
                  ) : null}
                </div>
              );
            })}
        </fieldset>
      ))}
      {problem ? <p className="text-sm text-bad">{problem}</p> : null}
      {save.error ? <ErrorNotice error={save.error} title="The interventions were not saved" /> : null}
      <div className="flex items-center gap-4">
        <button
          type="submit"
          disabled={save.isPending}
          className="rounded border border-accent px-4 py-2 text-sm text-accent-strong hover:bg-accent-tint disabled:opacity-60"
        >
          {save.isPending ? 'Saving…' : 'Save interventions'}
        </button>
        {saved ? (
          <p role="status" className="text-sm text-good">
            Saved.
          </p>
        ) : null}
      </div>
    </form>
  );
}
