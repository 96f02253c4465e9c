import { ApiError } from '../lib/api-client';
import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { useOutbox } from '../features/auth/api/get-outbox';

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** Development only: the e-mails the local fake mail server caught, with their links. */
export function Component() {
  const { data, error, isPending, refetch, isFetching } = useOutbox();
  return (
    <section className="space-y-4">
      <div className="flex items-baseline justify-between gap-4">
        <div>
          <h1 className="text-2xl font-semibold">Outbox</h1>
          <p className="text-sm text-ink-soft">
            E-mails caught by the local mail catcher while Loadline runs in development. Nothing here left this
            computer.
          </p>
        </div>
        <button
          type="button"
          onClick={() => void refetch()}
          disabled={isFetching}
          className="rounded border border-line px-3 py-1.5 text-sm text-ink-soft hover:text-ink"
        >
          {isFetching ? 'Checking…' : 'Check again'}
        </button>
      </div>
      {isPending ? <Loading label="Reading the outbox…" /> : null}
      {error instanceof ApiError && error.status === 404 ? (
        <EmptyState title="No outbox here">
          The outbox exists only in development; this server sends real e-mail.
        </EmptyState>
      ) : error ? (
        <ErrorNotice error={error} title="The outbox could not be read" onRetry={() => void refetch()} />
      ) : null}
      {data && data.messages.length === 0 ? (
        <EmptyState title="No e-mail yet">Invitations and reset links appear here as they are sent.</EmptyState>
      ) : null}
      <ul className="space-y-3">
        {data?.messages.map((m) => (
          <li key={`${m.id}-${m.receivedAt}`} className="rounded border border-line bg-surface px-4 py-3">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <p className="font-medium">{m.subject}</p>
              <p className="tabular text-xs text-ink-faint">{when(m.receivedAt)}</p>
            </div>
            <p className="text-sm text-ink-soft">To {m.to.join(', ')}</p>
            <ul className="mt-2 space-y-1">
              {m.links.map((l) => (
                <li key={l}>
                  <a href={l} className="break-all text-sm text-accent hover:underline">
                    {l}
                  </a>
                </li>
              ))}
            </ul>
            <details className="mt-2 text-sm">
              <summary className="cursor-pointer text-ink-soft">Plain-text part</summary>
              <pre className="mt-2 whitespace-pre-wrap text-xs text-ink">{m.text}</pre>
            </details>
          </li>
        ))}
      </ul>
    </section>
  );
}
