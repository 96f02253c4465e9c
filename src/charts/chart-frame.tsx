import { lazy, Suspense, useId, useState, type ReactNode } from 'react';
import type { ChartSpec } from './specs/types';

// The Vega libraries load on first use, in their own chunk, never with the app's entry bundle.
const VegaChart = lazy(() => import('./vega-chart'));

type Props = {
  title: string;
  /** One or two sentences that say what the chart shows, for everyone (and read first by screen readers). */
  summary: string;
  spec: ChartSpec;
  /** The accessible table behind the chart: the same numbers, in rows. */
  table: ReactNode;
  fileName: string;
  /** Shown under the title, e.g. which rule or target the chart uses. */
  note?: ReactNode;
  /** Height of the drawing area while the chart code loads, to keep the page from jumping. */
  minHeight?: number;
  testId?: string;
};

/** A chart with its title, a text summary, SVG/PNG download, and a "Show data table" toggle. */
export function ChartFrame({ title, summary, spec, table, fileName, note, minHeight = 280, testId }: Props) {
  const [showTable, setShowTable] = useState(false);
  const [failed, setFailed] = useState(false);
  const tableId = useId();
  const headingId = useId();
  return (
    <figure className="rounded border border-line bg-surface p-5" aria-labelledby={headingId} data-testid={testId}>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id={headingId} className="text-base font-medium text-ink">
            {title}
          </h2>
          {note ? <div className="mt-1 text-xs text-ink-soft">{note}</div> : null}
        </div>
        <button
          type="button"
          className="rounded border border-line px-3 py-1 text-xs text-accent-strong hover:bg-accent-tint"
          aria-expanded={showTable}
          aria-controls={tableId}
          onClick={() => setShowTable((v) => !v)}
        >
          {showTable ? 'Hide data table' : 'Show data table'}
        </button>
      </div>
      <div className="mt-4" style={{ minHeight }}>
        {failed ? (
          <p role="status" className="py-8 text-sm text-ink-soft">
            The chart could not be drawn here. The data table has the same numbers.
          </p>
        ) : (
          <Suspense fallback={<ChartLoading height={minHeight} />}>
            <VegaChart spec={spec} fileName={fileName} onError={() => setFailed(true)} />
          </Suspense>
        )}
      </div>
      <figcaption className="mt-2 text-xs leading-relaxed text-ink-soft">{summary}</figcaption>
      <div id={tableId} hidden={!showTable} className="relative mt-4 overflow-x-auto" data-chart-table>
        {table}
      </div>
    </figure>
  );
}

function ChartLoading({ height }: { height: number }) {
  return (
    <div
      role="status"
      aria-live="polite"
      className="flex items-center justify-center rounded bg-canvas"
      style={{ height }}
    >
      <span className="animate-pulse text-sm text-ink-faint">Drawing the chart…</span>
    </div>
  );
}
