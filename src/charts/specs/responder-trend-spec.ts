import type { OutcomesResponse } from '../../../shared/schemas/analytics';
import { INK, SERIES_COLOUR } from '../theme';
import type { ChartSpec } from './types';

/** Responder share by quarter of the start of care, with Wilson intervals and the target line. */
export function responderTrendSpec(trend: OutcomesResponse['trend'], target: number, description: string): ChartSpec {
  const rows = trend
    .filter((q) => q.share !== null)
    .map((q) => ({
      quarter: q.quarter,
      share: q.share!.estimate,
      lower: q.share!.lower,
      upper: q.share!.upper,
      n: q.nAnalysed,
    }));
  const x = {
    field: 'quarter',
    type: 'ordinal',
    title: 'Quarter the episode started',
    sort: trend.map((q) => q.quarter),
    axis: { labelAngle: 0 },
  };
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description,
    width: 'container',
    height: 220,
    autosize: { type: 'fit-x', contains: 'padding' },
    data: { values: rows },
    layer: [
      {
        mark: { type: 'rule', color: SERIES_COLOUR.focus, opacity: 0.6 },
        encoding: { x, y: { field: 'lower', type: 'quantitative' }, y2: { field: 'upper' } },
      },
      {
        mark: { type: 'line', point: true, color: SERIES_COLOUR.focus },
        encoding: {
          x,
          y: {
            field: 'share',
            type: 'quantitative',
            title: 'Responder share',
            axis: { format: '.0%' },
            scale: { domain: [0, 1] },
          },
          tooltip: [
            { field: 'quarter', title: 'Quarter' },
            { field: 'share', title: 'Responders', format: '.0%' },
            { field: 'n', title: 'Analysed' },
          ],
        },
      },
      {
        data: { values: [{ target }] },
        mark: { type: 'rule', strokeDash: [4, 4], color: INK.faint },
        encoding: { y: { field: 'target', type: 'quantitative' } },
      },
    ],
  };
}
