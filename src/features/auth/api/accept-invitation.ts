import { useMutation, useQueryClient } from '@tanstack/react-query';
import { AcceptInvitationInputSchema, type AcceptInvitationInput } from '../../../../shared/account';
import { MeResponseSchema } from '../../../../shared/auth';
import { apiFetch, resetCsrfToken } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { getMe } from './get-me';

export async function acceptInvitation(input: AcceptInvitationInput) {
  const res = await apiFetch('/api/invitations/accept', MeResponseSchema, {
    method: 'POST',
    body: AcceptInvitationInputSchema.parse(input),
  });
  resetCsrfToken();
  return res;
}

/** Sets name and password from the invitation; the server signs the new account in. */
export function useAcceptInvitation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    meta: { authFlow: true },
    onSuccess: async () => {
      client.removeQueries({ predicate: (q) => q.queryKey[0] !== 'health' });
      client.setQueryData(queryKeys.auth.me(), await getMe());
    },
  });
}
