import { FilterBar } from '../components/filter-bar';
import { useSession } from '../features/auth';
import { useRecovery } from '../features/analytics/api/get-recovery';
import { DashboardBody, DashboardHeader } from '../features/analytics/components/dashboard-parts';
import { RecoveryCurvePanel } from '../features/analytics/components/recovery-curve-panel';
import { RecoveryGroupsTable } from '../features/analytics/components/recovery-groups-table';
import { NO_FILTERS, useFilterParams } from '../features/analytics/filters';
import { levelLabel, SUBGROUP_LABELS, sortLevels } from '../features/analytics/labels';
import { pct } from '../features/analytics/format';
import { OKABE_ITO } from '../charts/theme';

/** Recovery curves: time to recovery by a chosen subgroup, with the numbers beside the curves. */
export function Component() {
  const { user } = useSession();
  const { filters, set } = useFilterParams();
  const q = useRecovery(filters);
  const data = q.data;
  const role = user?.role ?? 'researcher';
  const groups = data ? sortLevels(data.groupBy, data.groups) : [];
  const drawn = groups.filter((g) => !g.tooFew && g.curve);
  const tooFew = groups.filter((g) => g.tooFew);
  return (
    <section className="space-y-6" aria-busy={q.isFetching}>
      <DashboardHeader
        title="Recovery curves"
        meta={data?.meta}
        intro={
          role === 'researcher'
            ? 'Time to recovery across the whole registry, consenting episodes only, split by one subgroup at a time. Small counts are shown as a range.'
            : 'Time to recovery split by one subgroup at a time: activity, BMI band, age band, sex, symptom duration or baseline severity.'
        }
      />
      <FilterBar
        filters={filters}
        onChange={set}
        options={data?.meta.options}
        role={role}
        show={{ clinic: role !== 'researcher', groupBy: true }}
        busy={q.isFetching && !q.isPending}
      />
      <DashboardBody
        query={q}
        loading="Computing the recovery curves…"
        onReset={() => set(NO_FILTERS)}
        className="grid gap-6 2xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]"
      >
        {(data) => (
          <>
            {drawn.length === 0 ? (
              <p className="rounded border border-dashed border-line bg-surface px-6 py-10 text-sm text-ink-soft">
                No group has {data.meta.minCellEstimate} or more episodes with these filters, so no curve can be
                estimated. Widen the period or choose another subgroup.
              </p>
            ) : (
              <RecoveryCurvePanel
                testId="chart-recovery-groups"
                title={`Recovered over time by ${SUBGROUP_LABELS[data.groupBy].toLowerCase()}`}
                fileName={`loadline-recovery-by-${data.groupBy}`}
                note={
                  <>
                    Recovered = {data.rule.instrumentLabel.toLowerCase()}{' '}
                    {data.rule.direction === 'atMost' ? 'at or below' : 'at or above'} {data.rule.threshold}. Shaded:
                    95% intervals.
                    {tooFew.length ? ` Too few to estimate: ${tooFew.map((g) => levelLabel(g.level)).join(', ')}.` : ''}
                  </>
                }
                series={drawn.map((g) => ({
                  label: levelLabel(g.level),
                  points: g.curve ?? [],
                  readings: g.readings ?? [],
                  colour: OKABE_ITO[groups.indexOf(g) % OKABE_ITO.length],
                }))}
                summary={`Cumulative share recovered by week for each ${SUBGROUP_LABELS[data.groupBy].toLowerCase()} with at least ${data.meta.minCellEstimate} episodes. By week 12: ${drawn
                  .map((g) => `${levelLabel(g.level)} ${pct(g.atWeeks.find((a) => a.weeks === 12)?.estimate)}`)
                  .join(', ')}.`}
              />
            )}
            <RecoveryGroupsTable data={data} groups={groups} />
          </>
        )}
      </DashboardBody>
    </section>
  );
}
