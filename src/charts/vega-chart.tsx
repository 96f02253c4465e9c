import { useMemo } from 'react';
import { VegaEmbed } from 'react-vega';
import type { EmbedOptions, VisualizationSpec } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';
import { chartConfig } from './theme';
import type { ChartSpec } from './specs/types';

/**
 * The only module that imports the Vega libraries; it is loaded lazily (see chart-frame.tsx), so they
 * travel in their own chunk. Expressions run through vega-interpreter (`ast: true`), so charts render
 * under the app's Content-Security-Policy without 'unsafe-eval'. The menu offers SVG/PNG download only.
 */
const EMBED_OPTIONS: EmbedOptions = {
  renderer: 'svg',
  ast: true,
  expr: expressionInterpreter,
  config: chartConfig as unknown as EmbedOptions['config'],
  actions: { export: { svg: true, png: true }, source: false, compiled: false, editor: false },
  tooltip: true,
  i18n: { SVG_ACTION: 'Download as SVG', PNG_ACTION: 'Download as PNG', CLICK_TO_VIEW_ACTIONS: 'Download this chart' },
};

export type VegaChartProps = { spec: ChartSpec; fileName: string; onError?: (error: unknown) => void };

export default function VegaChart({ spec, fileName, onError }: VegaChartProps) {
  const options = useMemo(() => ({ ...EMBED_OPTIONS, downloadFileName: fileName }), [fileName]);
  return (
    <VegaEmbed
      spec={spec as unknown as VisualizationSpec}
      options={options}
      onError={onError}
      className="loadline-chart w-full"
    />
  );
}
