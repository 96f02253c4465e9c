import { useMutation, useQueryClient } from '@tanstack/react-query';
import { InvitationResponseSchema } from '../../../../shared/account';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** A fresh invitation link by e-mail; the earlier link stops working (sign-in work's endpoint). */
export const resendInvitation = (userId: number) =>
  apiFetch(`/api/invitations/${userId}/resend`, InvitationResponseSchema, { method: 'POST' });

export function useResendInvitation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: resendInvitation,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.admin.people() }),
  });
}
