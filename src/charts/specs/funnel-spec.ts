import type { ClinicsResponse } from '../../../shared/schemas/analytics';
import { INK, SERIES_COLOUR } from '../theme';
import type { ChartSpec } from './types';

export type FunnelMeasure = 'recovered' | 'responder';

/** Clinics by number of episodes and share, inside 95% and 99.8% limits around the centre line. */
export function funnelSpec(data: ClinicsResponse, measure: FunnelMeasure, description: string): ChartSpec {
  const centre = data.centre[measure];
  const points = data.clinics
    .filter((c) => c[measure].share !== null)
    .map((c) => ({
      label: c.label,
      n: c[measure].n,
      share: c[measure].share,
      own: c.highlighted ? 'Highlighted' : 'Peer',
      flag: c[measure].flag998,
    }));
  const limits = data.limits[measure].flatMap((l) => [
    { n: l.n, band: '95% limits', side: 'lower', value: l.lower95 },
    { n: l.n, band: '95% limits', side: 'upper', value: l.upper95 },
    { n: l.n, band: '99.8% limits', side: 'lower', value: l.lower998 },
    { n: l.n, band: '99.8% limits', side: 'upper', value: l.upper998 },
  ]);
  const x = { field: 'n', type: 'quantitative', title: 'Episodes with a known outcome' };
  const y = { type: 'quantitative', scale: { domain: [0, 1] } };
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description,
    width: 'container',
    height: 320,
    autosize: { type: 'fit-x', contains: 'padding' },
    layer: [
      {
        data: { values: limits },
        mark: { type: 'line', clip: true, strokeWidth: 1.25, color: INK.faint },
        encoding: {
          x,
          y: { field: 'value', ...y },
          detail: [{ field: 'band' }, { field: 'side' }],
          strokeDash: {
            field: 'band',
            type: 'nominal',
            title: null,
            scale: {
              domain: ['95% limits', '99.8% limits'],
              range: [
                [4, 3],
                [1, 0],
              ],
            },
          },
        },
      },
      ...(centre === null
        ? []
        : [
            {
              data: { values: [{ centre }] },
              mark: { type: 'rule', color: INK.soft },
              encoding: { y: { field: 'centre', type: 'quantitative' } },
            },
          ]),
      {
        data: { values: points },
        mark: { type: 'point', filled: true, opacity: 0.95 },
        encoding: {
          x,
          y: {
            field: 'share',
            ...y,
            title: measure === 'recovered' ? 'Share recovered by week 12' : 'Responder share',
            axis: { format: '.0%' },
          },
          color: {
            field: 'own',
            type: 'nominal',
            title: null,
            scale: { domain: ['Highlighted', 'Peer'], range: [SERIES_COLOUR.focus, INK.faint] },
            legend: null,
          },
          size: {
            field: 'own',
            type: 'nominal',
            scale: { domain: ['Highlighted', 'Peer'], range: [160, 60] },
            legend: null,
          },
          tooltip: [
            { field: 'label', title: 'Clinic' },
            { field: 'n', title: 'Episodes' },
            { field: 'share', title: 'Share', format: '.0%' },
          ],
        },
      },
      {
        data: { values: points.filter((p) => p.own === 'Highlighted') },
        mark: { type: 'text', align: 'left', dx: 9, dy: -9, fontWeight: 500, color: SERIES_COLOUR.focus },
        encoding: { x, y: { field: 'share', ...y }, text: { field: 'label' } },
      },
    ],
  };
}
