import type { ReactNode } from 'react';

export type ChartColumn<T> = { header: string; cell: (row: T) => ReactNode; numeric?: boolean };

/** The plain, accessible table behind a chart (tabular figures; numbers right-aligned). */
export function ChartTable<T>({
  caption,
  columns,
  rows,
  rowKey,
}: {
  caption: string;
  columns: ChartColumn<T>[];
  rows: T[];
  rowKey: (row: T, i: number) => string;
}) {
  return (
    <table className="tabular w-full text-left text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead className="border-b border-line text-xs text-ink-soft">
        <tr>
          {columns.map((c) => (
            <th key={c.header} scope="col" className={`px-3 py-2 font-medium ${c.numeric ? 'text-right' : ''}`}>
              {c.header}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((r, i) => (
          <tr key={rowKey(r, i)} className="border-b border-line last:border-0">
            {columns.map((c, j) =>
              j === 0 ? (
                <th key={c.header} scope="row" className="px-3 py-1.5 font-normal text-ink">
                  {c.cell(r)}
                </th>
              ) : (
                <td key={c.header} className={`px-3 py-1.5 ${c.numeric ? 'text-right' : ''}`}>
                  {c.cell(r)}
                </td>
              ),
            )}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
