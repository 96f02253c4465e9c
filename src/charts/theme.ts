/**
 * The one Vega-Lite theme of Loadline: every chart passes this config, so type, colour and spacing agree.
 * Plain data only (no vega import), so screens may read the palette without loading the charts chunk.
 */

/** Okabe-Ito, the colour-blind-safe categorical palette (Okabe & Ito 2008), in the order Loadline uses it. */
export const OKABE_ITO = [
  '#0072B2',
  '#E69F00',
  '#009E73',
  '#CC79A7',
  '#56B4E9',
  '#D55E00',
  '#F0E442',
  '#000000',
] as const;

/**
 * Colour roles, the same in every chart: the series in focus (your clinic, the crude estimate) is blue,
 * its comparison (the registry, the adjusted estimate) is orange; subgroup levels take the palette in order.
 */
export const SERIES_COLOUR = { focus: OKABE_ITO[0], comparison: OKABE_ITO[1], flag: OKABE_ITO[5] } as const;

export const INK = { text: '#1d2a2f', soft: '#4a5a60', faint: '#7b8a8f', line: '#dde3e1', grid: '#eef1f0' } as const;

export const FONT = '"IBM Plex Sans", system-ui, sans-serif';

export const chartConfig = {
  font: FONT,
  background: null,
  padding: 8,
  view: { stroke: null },
  range: { category: [...OKABE_ITO] },
  axis: {
    labelColor: INK.soft,
    titleColor: INK.soft,
    labelFontSize: 12,
    titleFontSize: 12,
    titleFontWeight: 500,
    domainColor: INK.line,
    tickColor: INK.line,
    gridColor: INK.grid,
    labelPadding: 4,
    titlePadding: 8,
  },
  legend: {
    labelColor: INK.text,
    titleColor: INK.soft,
    labelFontSize: 12,
    titleFontSize: 12,
    titleFontWeight: 500,
    orient: 'bottom',
    symbolType: 'stroke',
    symbolStrokeWidth: 3,
    symbolSize: 240,
  },
  header: { labelColor: INK.text, labelFontSize: 12, titleColor: INK.soft },
  title: { color: INK.text, fontSize: 13, fontWeight: 500, anchor: 'start', offset: 8 },
  line: { strokeWidth: 2 },
  point: { filled: true, size: 50 },
  rule: { color: INK.faint },
  text: { color: INK.soft, fontSize: 11 },
  // Tabular figures in every number the chart draws.
  numberFormat: ',.3~f',
} as const;

/** Week at which the three-month expectation is read; the rule drawn on recovery curves. */
export const EXPECTATION_WEEK = 12;
