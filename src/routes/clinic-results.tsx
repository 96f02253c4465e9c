import { FilterBar } from '../components/filter-bar';
import { useSession } from '../features/auth';
import { useOutcomes } from '../features/analytics/api/get-outcomes';
import { ChangePanel } from '../features/analytics/components/change-panel';
import { ClinicTiles } from '../features/analytics/components/clinic-tiles';
import { DashboardBody, DashboardHeader } from '../features/analytics/components/dashboard-parts';
import { RecoveryCurvePanel } from '../features/analytics/components/recovery-curve-panel';
import { TrendPanel } from '../features/analytics/components/trend-panel';
import { NO_FILTERS, useFilterParams } from '../features/analytics/filters';
import { pct } from '../features/analytics/format';
import { SERIES_COLOUR } from '../charts/theme';

/** Clinic results: one clinic against the three-month expectation and the registry. */
export function Component() {
  const { user } = useSession();
  const { filters, set } = useFilterParams();
  const q = useOutcomes(filters);
  const data = q.data;
  const role = user?.role ?? 'clinician';
  return (
    <section className="space-y-6" aria-busy={q.isFetching}>
      <DashboardHeader
        title="Clinic results"
        meta={data?.meta}
        intro="How episodes of care are doing against the registry’s three-month expectation: follow-up, responders, recovery and its timing, with the registry as a whole for comparison. These describe groups of patients, not any one patient."
      />
      <FilterBar
        filters={filters}
        onChange={set}
        options={data?.meta.options}
        role={role}
        show={{ clinic: true }}
        busy={q.isFetching && !q.isPending}
      />
      <DashboardBody
        query={q}
        loading="Computing the clinic’s results…"
        onReset={() => set(NO_FILTERS)}
        className="space-y-6"
      >
        {(data) => (
          <>
            {data.tiles.episodes === 0 ? (
              <p className="rounded border border-dashed border-line bg-surface px-6 py-8 text-sm text-ink-soft">
                No episode started in this period with these filters. Widen the period or clear a filter to see results.
              </p>
            ) : null}
            <ClinicTiles data={data} />
            <RecoveryCurvePanel
              testId="chart-recovery"
              title={`Recovered over time, with the week-${data.targetWeek} expectation`}
              fileName="loadline-clinic-recovery"
              target={data.tiles.recovered.target}
              note={`Recovered = ${data.recoveryRule.instrumentLabel.toLowerCase()} ${data.recoveryRule.direction === 'atMost' ? 'at or below' : 'at or above'} ${data.recoveryRule.threshold}. Shaded: 95% intervals. Diamond: the expectation of ${pct(data.tiles.recovered.target)} at week ${data.targetWeek}.`}
              series={data.curves.map((c) => ({
                label: c.label,
                points: c.points,
                readings: c.readings,
                colour: c.series === 'subject' ? SERIES_COLOUR.focus : SERIES_COLOUR.comparison,
              }))}
              summary={`Cumulative share recovered by week (Kaplan-Meier). ${data.curves
                .map((c) => `${c.label} (${c.n} episodes)`)
                .join(
                  ' and ',
                )}; by week ${data.targetWeek}, ${data.meta.subject.label} ${pct(data.tiles.recovered.share?.estimate)} against an expectation of ${pct(data.tiles.recovered.target)}.`}
            />
            <ChangePanel data={data} />
            <TrendPanel data={data} />
          </>
        )}
      </DashboardBody>
    </section>
  );
}
