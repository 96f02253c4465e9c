import type { ReactNode } from 'react';
import type { CurvePoint } from '../../../../shared/schemas/analytics';
import { ChartFrame } from '../../../charts/chart-frame';
import { ChartTable } from '../../../charts/chart-table';
import { recoveryCurveSpec, type CurveSeries } from '../../../charts/specs/recovery-curve-spec';
import { pct } from '../format';

type Row = CurvePoint & { series: string };

/** Cumulative recovery curves with CI bands and the week-12 rule; the table reads each curve every two weeks. */
export function RecoveryCurvePanel({
  title,
  series,
  summary,
  target,
  note,
  fileName,
  testId,
}: {
  title: string;
  series: CurveSeries[];
  summary: string;
  target?: number | null;
  note?: ReactNode;
  fileName: string;
  testId?: string;
}) {
  const rows: Row[] = series.flatMap((s) => s.readings.map((p) => ({ ...p, series: s.label })));
  return (
    <ChartFrame
      testId={testId}
      title={title}
      summary={summary}
      note={note}
      fileName={fileName}
      spec={recoveryCurveSpec({ series, description: summary, target })}
      minHeight={330}
      table={
        <ChartTable<Row>
          caption={`${title}: share recovered every two weeks`}
          rowKey={(r, i) => `${r.series}-${i}`}
          rows={rows}
          columns={[
            { header: 'Group', cell: (r) => r.series },
            { header: 'By week', cell: (r) => String(r.weeks), numeric: true },
            { header: 'Recovered', cell: (r) => pct(r.share), numeric: true },
            { header: '95% CI from', cell: (r) => pct(r.lower), numeric: true },
            { header: '95% CI to', cell: (r) => pct(r.upper), numeric: true },
          ]}
        />
      }
    />
  );
}
