import { ApiError } from '../lib/api-client';

/** What a stale edit (409 on a versioned change) says. */
export const STALE_EDIT = 'Someone else changed this episode after you opened it. Reload it to see their change, then make yours again.';

/** Plain words for a failed request; `conflict` replaces the server's message for a 409. */
export function errorText(error: unknown, conflict?: string): string {
  if (error instanceof ApiError) {
    if (error.status === 409 && conflict) return conflict;
    if (error.status === 401) return 'Your session has ended. Sign in again.';
    if (error.status === 403) return 'Your role cannot do this.';
    return error.message;
  }
  return 'The registry could not be reached. Check the connection and try again.';
}

/** A calm, announced error box for a failed load or save. */
export function ErrorNotice({
  error, title = 'That did not work', onRetry, conflict,
}: { error: unknown; title?: string; onRetry?: () => void; conflict?: string }) {
  return (
    <div role="alert" className="rounded border border-bad/40 bg-bad/5 px-4 py-3 text-sm">
      <p className="font-medium text-bad">{title}</p>
      <p className="mt-1 text-ink">{errorText(error, conflict)}</p>
      {onRetry ? (
        <button type="button" onClick={onRetry} className="mt-2 text-accent underline">
          Reload
        </button>
      ) : null}
    </div>
  );
}
