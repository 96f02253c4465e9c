import { useState } from 'react';
import type { FollowUpItem } from '../../shared/schemas/follow-ups';
import { DataTable, type PaginationState, type SortingState } from '../components/data-table';
import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { inputClass } from '../components/form-field';
import { Loading } from '../components/loading';
import { useSession } from '../features/auth';
import { useFollowUps, type FollowUpFilters } from '../features/follow-ups/api/list-follow-ups';
import { CompletenessPanel } from '../features/follow-ups/completeness-panel';
import { DigestToggle } from '../features/follow-ups/digest-toggle';
import { followUpColumns } from '../features/follow-ups/follow-up-columns';
import { LostProposals } from '../features/follow-ups/lost-proposals';
import { SelfReportLinkDialog } from '../features/follow-ups/self-report-link-dialog';

const PAGE_SIZE = 25;
const VIEWS = [
  { value: 'due,closing', label: 'Open now (all)' },
  { value: 'closing', label: 'Closing within a week' },
  { value: 'missed', label: 'Window passed without scores' },
  { value: 'upcoming', label: 'Not yet open' },
] as const;

/** Follow-ups: the clinic's open follow-up windows, with the two ways to fill one; leads also see completeness. */
export function Component() {
  const { user } = useSession();
  const [view, setView] = useState<string>(VIEWS[0].value);
  const [sorting, setSorting] = useState<SortingState>([{ id: 'closesOn', desc: false }]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: PAGE_SIZE });
  const [linkFor, setLinkFor] = useState<FollowUpItem | null>(null);
  const sort = (sorting[0]?.id ?? 'closesOn') as FollowUpFilters['sort'];
  const filters: FollowUpFilters = {
    state: view,
    sort,
    order: sorting[0]?.desc ? 'desc' : 'asc',
    limit: PAGE_SIZE,
    offset: pagination.pageIndex * PAGE_SIZE,
  };
  const { data, error, isPending, isFetching, refetch } = useFollowUps(filters);
  const columns = followUpColumns(setLinkFor);

  return (
    <section className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-semibold">Follow-ups</h1>
          <p className="max-w-prose text-sm text-ink-soft">
            Follow-up windows of your clinic’s open episodes (weeks 6, 12 and 26 after the start of care). Record the
            scores yourself, or give the patient a link to answer on their phone.
          </p>
        </div>
        <DigestToggle />
      </header>

      <div>
        <label htmlFor="follow-up-view" className="block text-sm font-medium">
          Show
        </label>
        <select
          id="follow-up-view"
          value={view}
          onChange={(e) => {
            setView(e.target.value);
            setPagination((p) => ({ ...p, pageIndex: 0 }));
          }}
          className={`${inputClass} w-72`}
        >
          {VIEWS.map((v) => (
            <option key={v.value} value={v.value}>
              {v.label}
            </option>
          ))}
        </select>
      </div>

      {error ? (
        <ErrorNotice error={error} title="The follow-ups could not be loaded" onRetry={() => void refetch()} />
      ) : isPending ? (
        <Loading label="Loading follow-ups…" />
      ) : (
        <DataTable
          caption="Follow-ups of your clinic"
          columns={columns}
          data={data.items}
          total={data.total}
          getRowId={(row) => `${row.episodeId}-${row.timepoint}`}
          pagination={pagination}
          onPaginationChange={setPagination}
          sorting={sorting}
          onSortingChange={(s) => {
            setSorting(s);
            setPagination((p) => ({ ...p, pageIndex: 0 }));
          }}
          busy={isFetching}
          empty={
            <EmptyState title="Nothing to record in this view.">
              Follow-up windows open a few weeks after the start of care.
            </EmptyState>
          }
        />
      )}

      {user?.role === 'lead' ? (
        <div className="grid gap-6 lg:grid-cols-2">
          <CompletenessPanel />
          <LostProposals />
        </div>
      ) : null}

      {linkFor ? <SelfReportLinkDialog item={linkFor} onClose={() => setLinkFor(null)} /> : null}
    </section>
  );
}
