import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';
import { queryKeys } from './query-keys';
import { notifyUnauthorized } from './session-events';

/** Mutations that answer 401 as part of their own flow (a wrong password) set `meta: { authFlow: true }`. */
declare module '@tanstack/react-query' {
  interface Register {
    mutationMeta: { authFlow?: boolean };
  }
}

/** A 401 anywhere: forget the session (guards then redirect) and tell the shell to go to sign-in. */
function onError(client: QueryClient, error: unknown, authFlow: boolean): void {
  if (!(error instanceof ApiError) || error.status !== 401 || authFlow) return;
  client.setQueryData(queryKeys.auth.me(), { user: null, outbox: false });
  notifyUnauthorized();
}

/** The app's QueryClient; tests build their own with the same behaviour. */
export function createQueryClient(overrides: { retry?: false } = {}): QueryClient {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (e) => onError(client, e, false) }),
    mutationCache: new MutationCache({ onError: (e, _v, _c, m) => onError(client, e, m.meta?.authFlow === true) }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: overrides.retry ?? ((count, error) => !(error instanceof ApiError && error.status < 500) && count < 2),
        refetchOnWindowFocus: false,
      },
    },
  });
  return client;
}

/** The one QueryClient of the app. */
export const queryClient = createQueryClient();
