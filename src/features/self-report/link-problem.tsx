import { ApiError } from '../../lib/api-client';

/** What the patient sees when the link cannot take answers: calm words, and what to do next. */
export function LinkProblem({ error }: { error: unknown }) {
  const status = error instanceof ApiError ? error.status : 0;
  const title =
    status === 410
      ? 'This link cannot take answers any more'
      : status === 404
        ? 'This link does not work'
        : status === 429
          ? 'Please wait a little'
          : 'The page could not be loaded';
  const body =
    error instanceof ApiError && status < 500
      ? error.message
      : 'We could not reach the service. Check your internet connection and open the link again in a few minutes.';
  return (
    <div role="alert" className="space-y-3 rounded border border-line bg-surface p-6">
      <h1 className="text-2xl font-semibold">{title}</h1>
      <p className="text-lg text-ink-soft">{body}</p>
      <p className="text-ink-soft">
        Nothing was saved from this visit. If you have questions about your care, please contact your clinic.
      </p>
    </div>
  );
}
