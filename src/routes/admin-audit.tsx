import { useSearchParams } from 'react-router-dom';
import { DataTable } from '../components/data-table';
import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { auditCsvUrl, useAuditList } from '../features/admin/api/list-audit';
import { auditColumns } from '../features/admin/audit/audit-columns';
import { AuditFilters } from '../features/admin/audit/audit-filters';
import { AUDIT_PAGE_SIZE, readAuditState, toAuditQuery, writeAuditState, type AuditState } from '../features/admin/audit/audit-params';
import { quietButton } from '../features/admin/components/buttons';
import { ConsoleFrame } from '../features/admin/components/console-frame';
import { useSession } from '../features/auth';

/** Registry console › Audit trail: every recorded change, filtered in the address bar, downloadable as CSV. */
export function Component() {
  const { user } = useSession();
  const [params, setParams] = useSearchParams();
  const state = readAuditState(params);
  const update = (next: Partial<AuditState>) => setParams(writeAuditState({ ...state, ...next }));
  const query = toAuditQuery(state);
  const { data, error, isFetching, refetch } = useAuditList(query);
  const filtered = Boolean(state.actor || state.action || state.entity || state.from || state.to);
  return (
    <ConsoleFrame
      title="Audit trail"
      intro={user?.role === 'lead' ? 'Every change recorded for your clinic: who did what, and when.' : 'Every change in the registry: who did what, to which record, and when. Newest first.'}
      actions={
        <a href={auditCsvUrl(query)} download className={quietButton}>
          Download this view (CSV)
        </a>
      }
    >
      <AuditFilters state={state} update={update} />
      {error ? (
        <ErrorNotice error={error} title="The audit trail could not be loaded" onRetry={() => void refetch()} />
      ) : !data ? (
        <Loading label="Loading the audit trail…" />
      ) : (
        <DataTable
          caption="Audit events"
          columns={auditColumns}
          data={data.items}
          total={data.total}
          getRowId={(e) => String(e.id)}
          pagination={{ pageIndex: state.page - 1, pageSize: AUDIT_PAGE_SIZE }}
          onPaginationChange={(p) => update({ page: p.pageIndex + 1 })}
          sorting={[]}
          onSortingChange={() => undefined}
          busy={isFetching}
          empty={<EmptyState title={filtered ? 'No event matches' : 'Nothing recorded yet'}>{filtered ? 'Widen the dates or clear a filter.' : undefined}</EmptyState>}
        />
      )}
    </ConsoleFrame>
  );
}
