import type { OutcomesResponse } from '../../../../shared/schemas/analytics';
import { ChartFrame } from '../../../charts/chart-frame';
import { ChartTable } from '../../../charts/chart-table';
import { changeHistogramSpec } from '../../../charts/specs/change-histogram-spec';
import { useWidth } from '../../../charts/use-width';
import { dec1, int, pct } from '../format';

type Row = OutcomesResponse['changes'][number];

/** Change scores at the primary follow-up per instrument, with the MCID marked. */
export function ChangePanel({ data }: { data: OutcomesResponse }) {
  const { ref, width } = useWidth<HTMLDivElement>();
  const changes = data.changes;
  if (changes.length === 0) {
    return (
      <section className="rounded border border-dashed border-line bg-surface px-6 py-8 text-sm text-ink-soft">
        No episode has both a baseline and a follow-up near week {data.targetWeek} yet, so there are no change scores to
        show.
      </section>
    );
  }
  const summary = `Improvement from baseline to the follow-up nearest week ${data.targetWeek}, per instrument; a dashed line marks each instrument's MCID. ${changes
    .map(
      (c) =>
        `${c.instrument.label}: median ${dec1(c.median)}, ${c.atLeastMcid === null ? 'no MCID' : `${pct(c.atLeastMcid / c.n)} at or past the MCID`} (n ${c.n})`,
    )
    .join('; ')}.`;
  return (
    <div ref={ref}>
      {width === 0 ? null : (
        <ChartFrame
          testId="chart-changes"
          title="Change scores at the primary follow-up"
          note="Positive values are improvement on every instrument (pain falling, function rising)."
          summary={summary}
          fileName="loadline-change-scores"
          spec={changeHistogramSpec(changes, summary, width - 40)}
          minHeight={Math.ceil(changes.length / (width >= 1000 ? 3 : 2)) * 210}
          table={
            <ChartTable<Row>
              caption="Change scores per instrument"
              rowKey={(r) => r.instrument.code}
              rows={changes}
              columns={[
                { header: 'Instrument', cell: (r) => r.instrument.label },
                { header: 'Episodes', cell: (r) => int(r.n), numeric: true },
                { header: 'Mean change', cell: (r) => dec1(r.meanChange), numeric: true },
                {
                  header: '95% CI',
                  cell: (r) => (r.meanLower === null ? '–' : `${dec1(r.meanLower)} to ${dec1(r.meanUpper)}`),
                  numeric: true,
                },
                { header: 'Median', cell: (r) => dec1(r.median), numeric: true },
                { header: 'Quartiles', cell: (r) => `${dec1(r.q1)} to ${dec1(r.q3)}`, numeric: true },
                {
                  header: 'MCID',
                  cell: (r) => (r.instrument.mcid === null ? 'none' : String(r.instrument.mcid)),
                  numeric: true,
                },
                {
                  header: 'At or past MCID',
                  cell: (r) => (r.atLeastMcid === null ? '–' : int(r.atLeastMcid)),
                  numeric: true,
                },
              ]}
            />
          }
        />
      )}
    </div>
  );
}
