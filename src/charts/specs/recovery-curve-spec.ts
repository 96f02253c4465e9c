import type { CurvePoint } from '../../../shared/schemas/analytics';
import { EXPECTATION_WEEK, INK, OKABE_ITO } from '../theme';
import type { ChartSpec } from './types';

/** `readings` (every two weeks) feed the table behind the chart; `points` (every step) are drawn. */
export type CurveSeries = { label: string; points: CurvePoint[]; readings: CurvePoint[]; colour?: string };

/**
 * Cumulative share recovered over weeks: one step line per series with its confidence band, a rule at the
 * expectation week and, when given, a mark at the target share there.
 */
export function recoveryCurveSpec(opts: {
  series: CurveSeries[];
  description: string;
  target?: number | null;
  maxWeeks?: number;
  height?: number;
}): ChartSpec {
  const rows = opts.series.flatMap((s) =>
    s.points.map((p) => ({ series: s.label, weeks: p.weeks, share: p.share, lower: p.lower, upper: p.upper })),
  );
  const domain = opts.series.map((s) => s.label);
  const range = opts.series.map((s, i) => s.colour ?? OKABE_ITO[i % OKABE_ITO.length]);
  const lastWeek = Math.max(EXPECTATION_WEEK + 4, ...rows.map((r) => r.weeks));
  const maxWeeks = Math.min(opts.maxWeeks ?? 52, Math.ceil(lastWeek));
  const colour = {
    field: 'series',
    type: 'nominal',
    title: null,
    scale: { domain, range },
    legend: { orient: 'bottom' },
  };
  const x = {
    field: 'weeks',
    type: 'quantitative',
    title: 'Weeks since the start of care',
    scale: { domain: [0, maxWeeks], nice: false },
  };
  const layers: ChartSpec[] = [
    {
      mark: { type: 'area', interpolate: 'step-after', opacity: 0.14, clip: true },
      encoding: { x, y: { field: 'lower', type: 'quantitative' }, y2: { field: 'upper' }, color: colour },
    },
    {
      mark: { type: 'line', interpolate: 'step-after', clip: true },
      encoding: {
        x,
        y: {
          field: 'share',
          type: 'quantitative',
          title: 'Share recovered',
          axis: { format: '.0%' },
          scale: { domain: [0, 1] },
        },
        color: colour,
        tooltip: [
          { field: 'series', title: 'Group' },
          { field: 'weeks', title: 'Week', format: '.1f' },
          { field: 'share', title: 'Recovered', format: '.0%' },
          { field: 'lower', title: 'CI from', format: '.0%' },
          { field: 'upper', title: 'CI to', format: '.0%' },
        ],
      },
    },
    {
      data: { values: [{ weeks: EXPECTATION_WEEK }] },
      mark: { type: 'rule', strokeDash: [4, 4], color: INK.faint },
      encoding: { x: { field: 'weeks', type: 'quantitative' } },
    },
  ];
  if (opts.target != null) {
    layers.push({
      data: { values: [{ weeks: EXPECTATION_WEEK, share: opts.target, label: 'Expectation' }] },
      mark: { type: 'point', shape: 'diamond', size: 90, filled: true, color: INK.text },
      encoding: {
        x: { field: 'weeks', type: 'quantitative' },
        y: { field: 'share', type: 'quantitative' },
        tooltip: [
          { field: 'label', title: 'Mark' },
          { field: 'share', title: 'Target', format: '.0%' },
        ],
      },
    });
  }
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: opts.description,
    width: 'container',
    height: opts.height ?? 300,
    autosize: { type: 'fit-x', contains: 'padding' },
    data: { values: rows },
    layer: layers,
  };
}
