import { queryOptions, useQuery } from '@tanstack/react-query';
import { SessionResponseSchema, type Session } from '../../../../shared/account';
import { ApiError, apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The signed-in user, or `user: null` when signed out (a 401 here is an answer, not an error). */
export async function getMe(signal?: AbortSignal): Promise<Session> {
  try {
    return await apiFetch('/api/auth/me', SessionResponseSchema, { signal });
  } catch (e) {
    if (e instanceof ApiError && e.status === 401) return { user: null, outbox: false };
    throw e;
  }
}

export const meQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.auth.me(), queryFn: ({ signal }) => getMe(signal), staleTime: 5 * 60_000 });

/** The session as the client knows it; `isPending` until the first answer. */
export function useSession() {
  const q = useQuery(meQueryOptions());
  return { user: q.data?.user ?? null, outbox: q.data?.outbox ?? false, isPending: q.isPending, error: q.error };
}
