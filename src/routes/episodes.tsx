import { Link, useSearchParams } from 'react-router-dom';
import { DataTable, type PaginationState, type SortingState } from '../components/data-table';
import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { paths } from '../config/paths';
import { useEpisodeList } from '../features/episodes/api/list-episodes';
import { episodeColumns } from '../features/episodes/episode-columns';
import { EpisodeFilters } from '../features/episodes/episode-filters';
import { PAGE_SIZE, readListState, toListQuery, writeListState, type ListState } from '../features/episodes/list-params';

type Sort = ListState['sort'];

/** Caseload: the clinic's episodes, paged, sorted and filtered by the server; the address bar keeps the state. */
export function Component() {
  const [params, setParams] = useSearchParams();
  const state = readListState(params);
  const { data, error, isPending, isFetching, refetch } = useEpisodeList(toListQuery(state));
  const update = (next: Partial<ListState>) => setParams(writeListState({ ...state, ...next }));

  const pagination: PaginationState = { pageIndex: state.page - 1, pageSize: PAGE_SIZE };
  const sorting: SortingState = [{ id: state.sort, desc: state.order === 'desc' }];

  return (
    <section className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-semibold">Caseload</h1>
          <p className="text-sm text-ink-soft">Your clinic’s episodes of heel-pain care, newest first.</p>
        </div>
        <div className="flex gap-2">
          <Link to={paths.upload} className="rounded border border-line bg-surface px-4 py-2 text-sm text-ink hover:border-accent">
            Upload a file
          </Link>
          <Link to={paths.newEpisode} className="rounded bg-accent px-4 py-2 text-sm font-medium text-white hover:bg-accent-strong">
            New episode
          </Link>
        </div>
      </header>

      <EpisodeFilters state={state} onChange={update} />

      {error ? (
        <ErrorNotice error={error} title="The caseload could not be loaded" onRetry={() => void refetch()} />
      ) : isPending ? (
        <Loading label="Loading the caseload…" />
      ) : (
        <DataTable
          caption="Episodes of your clinic"
          columns={episodeColumns}
          data={data.items}
          total={data.total}
          getRowId={(row) => String(row.id)}
          pagination={pagination}
          onPaginationChange={(p) => update({ page: p.pageIndex + 1 })}
          sorting={sorting}
          onSortingChange={(s) => {
            const first = s[0];
            if (first) update({ sort: first.id as Sort, order: first.desc ? 'desc' : 'asc', page: 1 });
          }}
          busy={isFetching}
          empty={
            <EmptyState title={state.q || state.status ? 'No episode matches' : 'No episodes yet'}>
              {state.q || state.status
                ? 'Try another reference or status.'
                : 'Start one with “New episode” or upload a file from your clinic system.'}
            </EmptyState>
          }
        />
      )}
      <p className="text-xs text-ink-faint">
        Scores summarise what was recorded; they are not treatment advice and do not replace clinical judgement.
      </p>
    </section>
  );
}
