import { FilterBar } from '../components/filter-bar';
import { useSession } from '../features/auth';
import { useClinics } from '../features/analytics/api/get-clinics';
import { DashboardBody, DashboardHeader } from '../features/analytics/components/dashboard-parts';
import { NO_FILTERS, useFilterParams } from '../features/analytics/filters';
import { int, pct } from '../features/analytics/format';
import { ChartFrame } from '../charts/chart-frame';
import { ChartTable } from '../charts/chart-table';
import { funnelSpec, type FunnelMeasure } from '../charts/specs/funnel-spec';
import type { ClinicsResponse } from '../../shared/schemas/analytics';

type Row = ClinicsResponse['clinics'][number];
const FLAG_WORDS = { above: 'above the limits', within: 'within the limits', below: 'below the limits' } as const;

/** Peer comparison: clinics on a funnel plot; only the viewer's own clinic is named. */
export function Component() {
  const { user } = useSession();
  const { filters, search, set } = useFilterParams();
  const measure: FunnelMeasure = search.get('measure') === 'responder' ? 'responder' : 'recovered';
  const q = useClinics(filters);
  const data = q.data;
  const role = user?.role ?? 'researcher';
  const label = measure === 'recovered' ? `Share recovered by week ${data?.targetWeek ?? 12}` : 'Responder share';
  const centre = data?.centre[measure] ?? null;
  const own = data?.clinics.find((c) => c.highlighted);
  const summary = data
    ? `${label} of ${data.clinics.length} clinics against the number of episodes with a known outcome, with 95% and 99.8% limits around the pooled share of ${pct(centre)}. ${
        own
          ? `${own.label}: ${pct(own[measure].share)} of ${own[measure].n}, ${own[measure].flag998 ? FLAG_WORDS[own[measure].flag998] : 'no limits'} at 99.8%.`
          : 'No clinic is highlighted.'
      }`
    : '';
  return (
    <section className="space-y-6" aria-busy={q.isFetching}>
      <DashboardHeader
        title="Peer comparison"
        meta={data?.meta}
        intro="Each active clinic as a point; the funnel shows how far a clinic of that size can sit from the pooled share by chance alone. Other clinics carry labels that change on every visit. A point outside the funnel is a prompt to look closer, not a ranking."
      />
      <FilterBar
        filters={filters}
        onChange={set}
        options={data?.meta.options}
        role={role}
        show={{ clinic: role === 'steward' }}
        busy={q.isFetching && !q.isPending}
      />
      <div role="radiogroup" aria-label="Measure" className="flex gap-2">
        {(['recovered', 'responder'] as const).map((m) => (
          <button
            key={m}
            type="button"
            role="radio"
            aria-checked={measure === m}
            onClick={() => set({ measure: m === 'recovered' ? undefined : m })}
            className={`rounded border px-3 py-1.5 text-sm ${measure === m ? 'border-accent bg-accent-tint text-accent-strong' : 'border-line bg-surface text-ink-soft'}`}
          >
            {m === 'recovered' ? 'Recovered by week 12' : 'Responders'}
          </button>
        ))}
      </div>
      <DashboardBody
        query={q}
        loading="Placing the clinics on the funnel…"
        onReset={() => set(NO_FILTERS)}
        className="space-y-4"
      >
        {(data) => (
          <>
            {data.clinics.length === 0 || centre === null ? (
              <p className="rounded border border-dashed border-line bg-surface px-6 py-10 text-sm text-ink-soft">
                No clinic has {data.minEpisodes} or more episodes with a known outcome here.
              </p>
            ) : (
              <ChartFrame
                testId="chart-funnel"
                title={`${label}, by clinic size`}
                note={`Centre line: pooled share ${pct(centre)}. Dashed: 95% limits; solid: 99.8% limits (exact binomial).${data.hiddenSmall ? ` ${data.hiddenSmall} clinic${data.hiddenSmall === 1 ? '' : 's'} with fewer than ${data.minEpisodes} episodes left out.` : ''}`}
                summary={summary}
                fileName={`loadline-peers-${measure}`}
                spec={funnelSpec(data, measure, summary)}
                minHeight={340}
                table={
                  <ChartTable<Row>
                    caption={`${label} by clinic`}
                    rowKey={(r) => r.label}
                    rows={data.clinics}
                    columns={[
                      { header: 'Clinic', cell: (r) => (r.name ? `${r.label} · ${r.name}` : r.label) },
                      { header: 'Episodes', cell: (r) => int(r.nEpisodes), numeric: true },
                      { header: 'Known outcome', cell: (r) => int(r[measure].n), numeric: true },
                      { header: 'Share', cell: (r) => pct(r[measure].share), numeric: true },
                      { header: '95% limits', cell: (r) => (r[measure].flag95 ? FLAG_WORDS[r[measure].flag95] : '–') },
                      {
                        header: '99.8% limits',
                        cell: (r) => (r[measure].flag998 ? FLAG_WORDS[r[measure].flag998] : '–'),
                      },
                    ]}
                  />
                }
              />
            )}
            {role === 'lead' && !own ? (
              <p className="text-sm text-ink-soft">
                Your clinic has fewer than {data.minEpisodes} episodes here, so it is not shown.
              </p>
            ) : null}
          </>
        )}
      </DashboardBody>
    </section>
  );
}
