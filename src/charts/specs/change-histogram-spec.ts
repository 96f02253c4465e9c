import type { OutcomesResponse } from '../../../shared/schemas/analytics';
import { INK, SERIES_COLOUR } from '../theme';
import type { ChartSpec } from './types';

/**
 * Change scores at the primary follow-up, one small histogram per instrument, the MCID marked.
 * `width` is the space available: two or three histograms a row, each sized to fit it.
 */
export function changeHistogramSpec(
  changes: OutcomesResponse['changes'],
  description: string,
  width: number,
): ChartSpec {
  const columns = width >= 960 ? 3 : width >= 560 ? 2 : 1;
  const cell = Math.max(180, Math.floor((width - 28 * (columns - 1)) / columns) - 70);
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description,
    columns,
    spacing: 28,
    concat: changes.map((c) => {
      const span = c.instrument.max - c.instrument.min;
      const layers: ChartSpec[] = [
        {
          mark: { type: 'bar', color: SERIES_COLOUR.focus, opacity: 0.85, cornerRadiusEnd: 1 },
          encoding: {
            x: {
              field: 'change',
              type: 'quantitative',
              bin: span <= 20 ? { step: 1 } : { maxbins: 20 },
              title: `Improvement (${c.instrument.unit})`,
            },
            y: { aggregate: 'count', type: 'quantitative', title: 'Episodes' },
            tooltip: [{ aggregate: 'count', type: 'quantitative', title: 'Episodes' }],
          },
        },
      ];
      if (c.instrument.mcid !== null) {
        layers.push({
          data: { values: [{ mcid: c.instrument.mcid }] },
          mark: { type: 'rule', strokeDash: [4, 3], color: INK.text, strokeWidth: 1.5 },
          encoding: { x: { field: 'mcid', type: 'quantitative' }, tooltip: [{ field: 'mcid', title: 'MCID' }] },
        });
      }
      return {
        title: { text: c.instrument.label, fontSize: 12 },
        width: cell,
        height: 150,
        data: { values: c.values.map((change) => ({ change })) },
        layer: layers,
      };
    }),
  };
}
