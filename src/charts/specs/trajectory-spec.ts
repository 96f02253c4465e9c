import type { TrajectoryResponse } from '../../../shared/schemas/analytics';
import { SERIES_COLOUR } from '../theme';
import type { ChartSpec } from './types';

type InstrumentSeries = TrajectoryResponse['instruments'][number];

/** One episode: the score over weeks with the band within one MCID of baseline, pain-rise flags, and daily steps. */
export function trajectorySpec(series: InstrumentSeries, data: TrajectoryResponse, description: string): ChartSpec {
  const i = series.instrument;
  const maxWeeks = Math.max(12, ...series.points.map((p) => p.weeks), ...data.steps.map((s) => s.weeks));
  const x = {
    field: 'weeks',
    type: 'quantitative',
    title: 'Weeks since the start of care',
    scale: { domain: [0, Math.ceil(maxWeeks)], nice: false },
  };
  const flagged = i.code === 'nprs-first-step' ? data.flags : [];
  const scoreLayers: ChartSpec[] = [];
  if (series.baseline !== null && series.mcidLevel !== null) {
    scoreLayers.push({
      data: { values: [{ from: series.baseline, to: series.mcidLevel }] },
      mark: { type: 'rect', color: SERIES_COLOUR.focus, opacity: 0.1 },
      encoding: {
        y: { field: 'from', type: 'quantitative' },
        y2: { field: 'to' },
        tooltip: [{ field: 'to', title: 'One MCID from baseline' }],
      },
    });
  }
  scoreLayers.push({
    data: { values: series.points },
    mark: { type: 'line', point: true, color: SERIES_COLOUR.focus },
    encoding: {
      x,
      y: { field: 'value', type: 'quantitative', title: `${i.label}`, scale: { domain: [i.min, i.max] } },
      tooltip: [
        { field: 'assessedOn', title: 'Date' },
        { field: 'timepoint', title: 'Timepoint' },
        { field: 'value', title: 'Score' },
      ],
    },
  });
  if (flagged.length) {
    scoreLayers.push({
      data: { values: flagged.map((f) => ({ ...f, note: `Pain rose from ${f.previous} to ${f.value}` })) },
      mark: { type: 'point', shape: 'triangle-up', size: 150, filled: true, color: SERIES_COLOUR.flag },
      encoding: {
        x,
        y: { field: 'value', type: 'quantitative' },
        tooltip: [
          { field: 'note', title: 'Flag' },
          { field: 'assessedOn', title: 'Date' },
        ],
      },
    });
  }
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description,
    spacing: 16,
    vconcat: [
      { width: 560, height: 200, layer: scoreLayers },
      {
        width: 560,
        height: 90,
        data: { values: data.steps },
        mark: { type: 'bar', width: 10, color: SERIES_COLOUR.comparison, opacity: 0.85 },
        encoding: {
          x,
          y: { field: 'steps', type: 'quantitative', title: 'Average daily steps' },
          tooltip: [
            { field: 'assessedOn', title: 'Date' },
            { field: 'steps', title: 'Steps', format: ',' },
          ],
        },
      },
    ],
  };
}
