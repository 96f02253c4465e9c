/** A Vega-Lite specification as plain JSON (built by the spec functions, typed loosely on purpose). */
export type ChartSpec = Record<string, unknown>;
