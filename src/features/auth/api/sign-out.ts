import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiFetch, resetCsrfToken } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { notifySignedOut } from '../../../lib/session-events';

export async function signOut(): Promise<void> {
  try {
    await apiFetch('/api/auth/logout', z.undefined(), { method: 'POST' });
  } finally {
    resetCsrfToken();
    notifySignedOut();
  }
}

/** Signs out and forgets every cached answer, so nothing of this user stays in memory. */
export function useSignOut() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    meta: { authFlow: true },
    onSettled: () => {
      client.clear();
      client.setQueryData(queryKeys.auth.me(), { user: null, outbox: false });
    },
  });
}
