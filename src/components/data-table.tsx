import type { ReactNode } from 'react';
import {
  createColumnHelper, functionalUpdate, rowPaginationFeature, rowSortingFeature, tableFeatures, useTable,
  type ColumnDef, type PaginationState, type RowData, type SortingState, type Updater,
} from '@tanstack/react-table';

/** The features every server-driven table registers: sorting and pagination, both done by the server. */
export const dataTableFeatures = tableFeatures({ rowSortingFeature, rowPaginationFeature });
export type DataTableFeatures = typeof dataTableFeatures;
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each column keeps its own value type
export type DataColumn<T extends RowData> = ColumnDef<DataTableFeatures, T, any>;
export const dataColumnHelper = <T extends RowData>() => createColumnHelper<DataTableFeatures, T>();
export type { PaginationState, SortingState };

type Props<T extends RowData> = {
  /** Names the table for screen readers (visually hidden). */
  caption: string;
  columns: DataColumn<T>[];
  data: T[];
  total: number;
  pagination: PaginationState;
  onPaginationChange: (next: PaginationState) => void;
  sorting: SortingState;
  onSortingChange: (next: SortingState) => void;
  getRowId: (row: T) => string;
  /** Shown in place of the body when there are no rows. */
  empty?: ReactNode;
  /** A newer page is on its way; the current rows stay visible but are dimmed. */
  busy?: boolean;
};

const SORT_LABEL = { asc: 'ascending', desc: 'descending' } as const;

/**
 * A TanStack Table wrapper for server-paginated, server-sorted lists: the caller owns the state
 * (usually in URL search params) and fetches the page; this renders the markup, sort buttons and pager.
 */
export function DataTable<T extends RowData>(props: Props<T>) {
  const { pagination, sorting } = props;
  const table = useTable({
    features: dataTableFeatures,
    columns: props.columns,
    data: props.data,
    rowCount: props.total,
    getRowId: props.getRowId,
    manualPagination: true,
    manualSorting: true,
    enableSortingRemoval: false,
    state: { pagination, sorting },
    onPaginationChange: (u: Updater<PaginationState>) => props.onPaginationChange(functionalUpdate(u, pagination)),
    onSortingChange: (u: Updater<SortingState>) => props.onSortingChange(functionalUpdate(u, sorting)),
  });
  const rows = table.getRowModel().rows;
  const first = props.total === 0 ? 0 : pagination.pageIndex * pagination.pageSize + 1;
  const last = Math.min(props.total, (pagination.pageIndex + 1) * pagination.pageSize);

  return (
    <div className="space-y-3">
      <div className="relative overflow-x-auto rounded border border-line bg-surface">
        <table className={`tabular w-full text-left text-sm ${props.busy ? 'opacity-60' : ''}`} aria-busy={props.busy}>
          <caption className="sr-only">{props.caption}</caption>
          <thead className="border-b border-line bg-canvas text-xs text-ink-soft">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted ? SORT_LABEL[sorted] : canSort ? 'none' : undefined}
                      className="px-4 py-2 font-medium"
                    >
                      {header.isPlaceholder ? null : canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="inline-flex items-center gap-1 hover:text-ink"
                        >
                          <table.FlexRender header={header} />
                          <span aria-hidden className="text-ink-faint">
                            {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                          </span>
                        </button>
                      ) : (
                        <table.FlexRender header={header} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.length === 0 ? (
              <tr>
                <td colSpan={props.columns.length} className="px-4 py-6">
                  {props.empty ?? <span className="text-ink-soft">Nothing to show.</span>}
                </td>
              </tr>
            ) : (
              rows.map((row) => (
                <tr key={row.id} className="border-b border-line last:border-0 hover:bg-canvas">
                  {row.getAllCells().map((cell) => (
                    <td key={cell.id} className="px-4 py-2.5 align-top">
                      <table.FlexRender cell={cell} />
                    </td>
                  ))}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
      <nav aria-label={`Pages of ${props.caption}`} className="flex flex-wrap items-center justify-between gap-3 text-sm">
        <p className="tabular text-ink-soft" aria-live="polite">
          {props.total === 0 ? 'No rows' : first === last ? `Row ${first} of ${props.total}` : `Rows ${first}–${last} of ${props.total}`}
        </p>
        <div className="flex items-center gap-2">
          <span className="tabular text-ink-faint">
            Page {pagination.pageIndex + 1} of {Math.max(1, table.getPageCount())}
          </span>
          <button type="button" className={pagerClass} onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous
          </button>
          <button type="button" className={pagerClass} onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next
          </button>
        </div>
      </nav>
    </div>
  );
}

const pagerClass =
  'rounded border border-line bg-surface px-3 py-1.5 text-ink hover:border-accent disabled:cursor-not-allowed disabled:text-ink-faint disabled:hover:border-line';
