import type { ReactNode } from 'react';

/** A column heading: its text, right-aligned for numbers, or read only by screen readers (e.g. an actions column). */
export type TableColumn = { label: ReactNode; key?: string; numeric?: boolean; hidden?: boolean };

/**
 * The frame of every plain data table: a bordered box that scrolls sideways on its own when the table is
 * wider than the screen, a caption for screen readers, and one heading row. The box is `relative` so that
 * the caption (positioned absolutely by `sr-only`) stays inside it instead of widening the whole page.
 * Rows are the children (the `<tbody>` content).
 */
export function TableFrame({
  caption,
  columns,
  cell = 'px-3 py-2',
  children,
}: {
  caption: string;
  columns: readonly (TableColumn | string)[];
  /** Padding of the heading cells, to match the body cells. */
  cell?: string;
  children: ReactNode;
}) {
  return (
    <div className="relative overflow-x-auto rounded border border-line bg-surface">
      <table className="tabular w-full text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-line bg-canvas text-xs text-ink-soft">
          <tr>
            {columns.map((c, i) => {
              const col = typeof c === 'string' ? { label: c } : c;
              return (
                <th key={col.key ?? i} scope="col" className={`${cell} font-medium${col.numeric ? ' text-right' : ''}`}>
                  {col.hidden ? <span className="sr-only">{col.label}</span> : col.label}
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
