import type { DataRequest } from '../../shared/schemas/data-request';
import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { useSession } from '../features/auth';
import { useDataRequests } from '../features/data-requests/api/list-data-requests';
import { DecisionForm } from '../features/data-requests/decision-form';
import { NewRequestForm } from '../features/data-requests/new-request-form';
import { RequestCard } from '../features/data-requests/request-card';

/** Data requests: a researcher asks for a cohort's de-identified data; the steward approves or declines. */
export function Component() {
  const { user } = useSession();
  const requests = useDataRequests();
  const steward = user?.role === 'steward';
  return (
    <section className="space-y-6">
      <header className="space-y-1">
        <h1 className="text-2xl font-semibold">Data requests</h1>
        <p className="max-w-prose text-sm text-ink-soft">
          {steward
            ? 'Requests waiting for your decision, then every decided request. An approval sets how long the requester may download and how the file is de-identified.'
            : 'Ask for the de-identified data of one of your saved cohorts. Once the steward approves, you can download the CSV and its data dictionary until the expiry day.'}
        </p>
      </header>
      {!steward ? (
        <div className="max-w-2xl space-y-3 rounded border border-line bg-surface p-5">
          <h2 className="text-base font-semibold">New request</h2>
          <NewRequestForm />
        </div>
      ) : null}
      {requests.error ? (
        <ErrorNotice
          error={requests.error}
          title="The requests could not be loaded"
          onRetry={() => void requests.refetch()}
        />
      ) : !requests.data ? (
        <Loading label="Loading the requests…" />
      ) : (
        <Lists items={requests.data.items} steward={steward} />
      )}
      <p className="text-xs text-ink-faint">
        Exports hold no names, clinic names, episode references, pseudonyms or calendar dates; use them only for the
        purpose approved and never try to re-identify anyone.
      </p>
    </section>
  );
}

function Lists({ items, steward }: { items: DataRequest[]; steward: boolean }) {
  if (items.length === 0) return <EmptyState title="No data request yet" />;
  const pending = items.filter((r) => r.status === 'pending');
  const decided = items.filter((r) => r.status !== 'pending');
  return (
    <div className="space-y-6">
      <div className="space-y-3">
        <h2 className="text-base font-semibold">
          {steward ? `Waiting for a decision (${pending.length})` : 'Waiting'}
        </h2>
        {pending.length === 0 ? <p className="text-sm text-ink-soft">Nothing waiting.</p> : null}
        {pending.map((r) => (
          <RequestCard key={r.id} request={r} showRequester={steward}>
            {steward ? <DecisionForm request={r} /> : null}
          </RequestCard>
        ))}
      </div>
      <div className="space-y-3">
        <h2 className="text-base font-semibold">Decided</h2>
        {decided.length === 0 ? <p className="text-sm text-ink-soft">No decision yet.</p> : null}
        {decided.map((r) => (
          <RequestCard key={r.id} request={r} showRequester={steward} />
        ))}
      </div>
    </div>
  );
}
