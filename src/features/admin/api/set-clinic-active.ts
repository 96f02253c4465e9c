import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ClinicSummarySchema } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Deactivate (stops submissions and peer comparison; keeps the data) or reactivate a clinic. */
export const setClinicActive = (id: number, active: boolean) =>
  apiFetch(`/api/admin/clinics/${id}/${active ? 'reactivate' : 'deactivate'}`, ClinicSummarySchema, { method: 'POST' });

export function useSetClinicActive() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, active }: { id: number; active: boolean }) => setClinicActive(id, active),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.admin.clinics() }),
  });
}
