import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ResetInputSchema, type ResetInput } from '../../../../shared/account';
import { apiFetch, resetCsrfToken } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export async function resetPassword(input: ResetInput): Promise<void> {
  await apiFetch('/api/auth/reset', z.undefined(), { method: 'POST', body: ResetInputSchema.parse(input) });
  resetCsrfToken();
}

/** A new password ends every session of the account, this browser's included. */
export function useResetPassword() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: resetPassword,
    meta: { authFlow: true },
    onSuccess: () => {
      client.clear();
      client.setQueryData(queryKeys.auth.me(), { user: null, outbox: false });
    },
  });
}
