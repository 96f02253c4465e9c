import type { AddOnRow } from '../../../shared/schemas/analytics';
import { INK, SERIES_COLOUR } from '../theme';
import type { ChartSpec } from './types';

/** Risk ratio of responding with versus without each add-on: crude and adjusted, 95% CIs, log scale, line at 1. */
export function forestSpec(rows: AddOnRow[], description: string): ChartSpec {
  const points = rows.flatMap((r) =>
    (
      [
        ['Crude', r.crude],
        ['Adjusted (Mantel-Haenszel)', r.adjusted],
      ] as const
    ).flatMap(([kind, v]) => (v ? [{ label: r.label, kind, rr: v.riskRatio, lower: v.lower, upper: v.upper }] : [])),
  );
  const all = points.flatMap((p) => [p.lower, p.upper]);
  const lo = Math.min(0.5, ...all);
  const hi = Math.max(2, ...all);
  const y = { field: 'label', type: 'nominal', title: null, sort: rows.map((r) => r.label), axis: { labelLimit: 220 } };
  const colour = {
    field: 'kind',
    type: 'nominal',
    title: null,
    scale: { domain: ['Crude', 'Adjusted (Mantel-Haenszel)'], range: [SERIES_COLOUR.focus, SERIES_COLOUR.comparison] },
  };
  const x = { type: 'quantitative', scale: { type: 'log', domain: [lo * 0.9, hi * 1.1], nice: false } };
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description,
    width: 'container',
    height: Math.max(120, rows.length * 46),
    autosize: { type: 'fit-x', contains: 'padding' },
    data: { values: points },
    layer: [
      {
        data: { values: [{ one: 1 }] },
        mark: { type: 'rule', color: INK.soft, strokeDash: [3, 3] },
        encoding: { x: { field: 'one', ...x } },
      },
      {
        mark: { type: 'rule', strokeWidth: 2 },
        encoding: {
          y,
          yOffset: { field: 'kind', scale: { paddingOuter: 0.6 } },
          x: { field: 'lower', ...x },
          x2: { field: 'upper' },
          color: colour,
        },
      },
      {
        mark: { type: 'point', filled: true, size: 60, shape: 'square' },
        encoding: {
          y,
          yOffset: { field: 'kind', scale: { paddingOuter: 0.6 } },
          x: { field: 'rr', ...x, title: 'Risk ratio of responding, with vs without (log scale)' },
          color: colour,
          tooltip: [
            { field: 'label', title: 'Add-on' },
            { field: 'kind', title: 'Estimate' },
            { field: 'rr', title: 'Risk ratio', format: '.2f' },
            { field: 'lower', title: 'CI from', format: '.2f' },
            { field: 'upper', title: 'CI to', format: '.2f' },
          ],
        },
      },
    ],
  };
}
