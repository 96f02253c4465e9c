import { useMutation, useQueryClient } from '@tanstack/react-query';
import { AccountResponseSchema } from '../../../../shared/account';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Ends the person's access and sessions (sign-in work's endpoint); their recorded work stays. */
export const deactivatePerson = (userId: number) =>
  apiFetch(`/api/users/${userId}/deactivate`, AccountResponseSchema, { method: 'POST' });

export function useDeactivatePerson() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: deactivatePerson,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.admin.all() }),
  });
}
