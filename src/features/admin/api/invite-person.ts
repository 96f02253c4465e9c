import { useMutation, useQueryClient } from '@tanstack/react-query';
import { InvitationResponseSchema, type InvitationInput } from '../../../../shared/account';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Invitations belong to the sign-in work: the console calls its endpoint, it does not make its own. */
export const invitePerson = (input: InvitationInput) =>
  apiFetch('/api/invitations', InvitationResponseSchema, { method: 'POST', body: input });

export function useInvitePerson() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: invitePerson,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.admin.all() }),
  });
}
