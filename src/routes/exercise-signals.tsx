import { FilterBar } from '../components/filter-bar';
import { useSession } from '../features/auth';
import { useAddOns } from '../features/analytics/api/get-addons';
import { AssociationCaution, DashboardBody, DashboardHeader } from '../features/analytics/components/dashboard-parts';
import { NO_FILTERS, useFilterParams } from '../features/analytics/filters';
import { count, pValue, ratio } from '../features/analytics/format';
import { ChartFrame } from '../charts/chart-frame';
import { ChartTable } from '../charts/chart-table';
import { forestSpec } from '../charts/specs/forest-spec';
import type { AddOnRow } from '../../shared/schemas/analytics';

const ci = (v: AddOnRow['crude']) => (v ? `${ratio(v.riskRatio)} (${ratio(v.lower)} to ${ratio(v.upper)})` : '–');

/** Exercise signals: how responding differs with and without each add-on exercise (associations only). */
export function Component() {
  const { user } = useSession();
  const { filters, set } = useFilterParams();
  const q = useAddOns(filters);
  const data = q.data;
  const role = user?.role ?? 'researcher';
  const estimable = data?.rows.filter((r) => !r.suppressed && (r.crude || r.adjusted)) ?? [];
  const min = data?.meta.minCellShown ?? null;
  const summary = data
    ? `Risk ratio of responding with versus without each add-on, crude and adjusted for ${data.stratifiedBy}, with 95% intervals on a log scale; 1 means no difference. ${estimable
        .map((r) => `${r.label}: adjusted ${ratio(r.adjusted?.riskRatio)}, BH-adjusted p ${pValue(r.pAdjusted)}`)
        .join('; ')}.`
    : '';
  return (
    <section className="space-y-6" aria-busy={q.isFetching}>
      <DashboardHeader
        title="Exercise signals"
        meta={data?.meta}
        intro="Whether patients who received an add-on exercise responded more or less often than those who did not, with p-values adjusted for looking at many add-ons at once."
      />
      <AssociationCaution />
      <FilterBar
        filters={filters}
        onChange={set}
        options={data?.meta.options}
        role={role}
        show={{ clinic: role !== 'researcher' }}
        busy={q.isFetching && !q.isPending}
      />
      <DashboardBody
        query={q}
        loading="Comparing responders with and without each add-on…"
        onReset={() => set(NO_FILTERS)}
        className="space-y-6"
      >
        {(data) => (
          <>
            {estimable.length === 0 ? (
              <p className="rounded border border-dashed border-line bg-surface px-6 py-10 text-sm text-ink-soft">
                No add-on has {data.minArm} or more episodes both with and without it here, so no ratio is shown. Widen
                the period or look at the whole registry.
              </p>
            ) : (
              <ChartFrame
                testId="chart-forest"
                title="Risk ratio of responding, with versus without each add-on"
                note={`Responder: improvement of at least the MCID (${data.instrument.mcid} ${data.instrument.unit}) on ${data.instrument.label} near week 12. Adjusted: Mantel-Haenszel over ${data.stratifiedBy}.`}
                summary={summary}
                fileName="loadline-exercise-signals"
                spec={forestSpec(estimable, summary)}
                minHeight={Math.max(200, estimable.length * 34 + 80)}
                table={<AddOnTable rows={data.rows} min={min} minArm={data.minArm} />}
              />
            )}
            <AddOnTable rows={data.rows} min={min} minArm={data.minArm} visible />
            <p className="text-xs text-ink-faint">
              {count(data.nEpisodes, min)} episodes; {count(data.nMissingOutcome, min)} without a follow-up near week 12
              are left out of every comparison.
            </p>
          </>
        )}
      </DashboardBody>
    </section>
  );
}

function AddOnTable({
  rows,
  min,
  minArm,
  visible,
}: {
  rows: AddOnRow[];
  min: number | null;
  minArm: number;
  visible?: boolean;
}) {
  const table = (
    <ChartTable<AddOnRow>
      caption="Responders with and without each add-on"
      rowKey={(r) => r.code}
      rows={rows}
      columns={[
        { header: 'Add-on', cell: (r) => r.label },
        {
          header: 'With: responders / n',
          cell: (r) => `${count(r.withAddOn.responders, min)} / ${count(r.withAddOn.n, min)}`,
          numeric: true,
        },
        {
          header: 'Without: responders / n',
          cell: (r) => `${count(r.withoutAddOn.responders, min)} / ${count(r.withoutAddOn.n, min)}`,
          numeric: true,
        },
        {
          header: 'Crude risk ratio (95% CI)',
          cell: (r) => (r.suppressed ? `fewer than ${minArm} in an arm` : ci(r.crude)),
          numeric: true,
        },
        { header: 'Adjusted risk ratio (95% CI)', cell: (r) => (r.suppressed ? '–' : ci(r.adjusted)), numeric: true },
        { header: 'p', cell: (r) => pValue(r.pValue), numeric: true },
        { header: 'p, BH-adjusted', cell: (r) => pValue(r.pAdjusted), numeric: true },
      ]}
    />
  );
  if (!visible) return table;
  return (
    <div className="relative overflow-x-auto rounded border border-line bg-surface p-2" data-testid="addon-table">
      {table}
    </div>
  );
}
