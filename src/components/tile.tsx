import type { ReactNode } from 'react';

/** One labelled fact or figure in a grid of tiles. */
export function Tile({ label, children, note }: { label: string; children: ReactNode; note?: ReactNode }) {
  return (
    <div className="rounded border border-line bg-surface px-4 py-3">
      <dt className="text-xs uppercase tracking-wide text-ink-faint">{label}</dt>
      <dd className="tabular mt-1 text-lg text-ink">{children}</dd>
      {note ? <dd className="mt-0.5 text-xs text-ink-soft">{note}</dd> : null}
    </div>
  );
}

/** A responsive grid of tiles (a description list, so label and value stay paired for screen readers). */
export function TileGrid({ children }: { children: ReactNode }) {
  return <dl className="grid grid-cols-2 gap-3 md:grid-cols-3 lg:grid-cols-4">{children}</dl>;
}
