import { useState } from 'react';
import type { UploadRecord } from '../../../shared/schemas/upload';
import { DataTable, dataColumnHelper, type PaginationState } from '../../components/data-table';
import { EmptyState } from '../../components/empty-state';
import { ErrorNotice } from '../../components/error-notice';
import { Loading } from '../../components/loading';
import { useUploadList } from './api/list-uploads';

const STATUS_WORDS: Record<UploadRecord['status'], string> = {
  committed: 'Saved',
  'dry-run': 'Checked only',
  rejected: 'Refused',
};
const col = dataColumnHelper<UploadRecord>();
const columns = col.columns([
  col.accessor('createdAt', {
    header: 'When',
    enableSorting: false,
    cell: (info) => new Date(info.getValue()).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' }),
  }),
  col.accessor('fileName', { header: 'File', enableSorting: false }),
  col.accessor('rowCount', { header: 'Rows', enableSorting: false }),
  col.accessor('accepted', { header: 'Accepted', enableSorting: false }),
  col.accessor('rejected', { header: 'Rejected', enableSorting: false }),
  col.accessor('status', { header: 'Outcome', enableSorting: false, cell: (info) => STATUS_WORDS[info.getValue()] }),
]);
const NO_SORT: never[] = [];
const PAGE = 10;

/** The clinic's earlier uploads, newest first. */
export function PastUploads() {
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: PAGE });
  const { data, error, isPending, isFetching } = useUploadList({ limit: PAGE, offset: pagination.pageIndex * PAGE });
  if (error) return <ErrorNotice error={error} title="Earlier uploads could not be loaded" />;
  if (isPending) return <Loading label="Loading earlier uploads…" />;
  return (
    <DataTable
      caption="Earlier uploads"
      columns={columns}
      data={data.items}
      total={data.total}
      getRowId={(r) => String(r.id)}
      pagination={pagination}
      onPaginationChange={setPagination}
      sorting={NO_SORT}
      onSortingChange={() => undefined}
      busy={isFetching}
      empty={<EmptyState title="No uploads yet">Files you save appear here.</EmptyState>}
    />
  );
}
