import type { OutcomesResponse } from '../../../../shared/schemas/analytics';
import { ChartFrame } from '../../../charts/chart-frame';
import { ChartTable } from '../../../charts/chart-table';
import { responderTrendSpec } from '../../../charts/specs/responder-trend-spec';
import { int, pct, pctInterval } from '../format';

type Row = OutcomesResponse['trend'][number];

/** Responder share by quarter of the start of care, with the registry's target. */
export function TrendPanel({ data }: { data: OutcomesResponse }) {
  const r = data.tiles.responders;
  if (!r || data.trend.length === 0) return null;
  const shown = data.trend.filter((q) => !q.tooFew);
  const summary = shown.length
    ? `Responder share by the quarter in which care started, against the target of ${pct(r.target)}: ${shown
        .map((q) => `${q.quarter} ${pct(q.share?.estimate)}`)
        .join(', ')}. Quarters with fewer than ${data.meta.minCellEstimate} analysed episodes are left out.`
    : `No quarter has ${data.meta.minCellEstimate} or more analysed episodes yet.`;
  return (
    <ChartFrame
      testId="chart-trend"
      title="Responder share by quarter"
      note={`Dashed line: the registry's target of ${pct(r.target)}. Vertical lines: 95% intervals.`}
      summary={summary}
      fileName="loadline-responders-by-quarter"
      spec={responderTrendSpec(data.trend, r.target, summary)}
      minHeight={240}
      table={
        <ChartTable<Row>
          caption="Responder share by quarter"
          rowKey={(q) => q.quarter}
          rows={data.trend}
          columns={[
            { header: 'Quarter', cell: (q) => q.quarter },
            { header: 'Analysed', cell: (q) => int(q.nAnalysed), numeric: true },
            { header: 'Responders', cell: (q) => int(q.responders), numeric: true },
            { header: 'Share', cell: (q) => (q.tooFew ? 'too few' : pct(q.share?.estimate)), numeric: true },
            { header: '95% CI', cell: (q) => (q.tooFew ? '–' : pctInterval(q.share)), numeric: true },
          ]}
        />
      }
    />
  );
}
