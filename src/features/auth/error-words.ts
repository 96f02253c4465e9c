import { ApiError } from '../../lib/api-client';

/** The message to show for a failed account request; the server's words where it gave some. */
export function accountErrorText(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.status === 422) return 'Some fields are not valid; see the notes beside them.';
    return error.message;
  }
  return 'The registry could not be reached. Check the connection and try again.';
}

/** The server's field issues (422) as `{ field: message }`, for react-hook-form's setError. */
export function fieldIssues(error: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  if (!(error instanceof ApiError) || !Array.isArray(error.issues)) return out;
  for (const i of error.issues as Array<{ path?: unknown[]; message?: string }>) {
    const key = i.path?.[0];
    if (typeof key === 'string' && i.message && !out[key]) out[key] = i.message;
  }
  return out;
}
