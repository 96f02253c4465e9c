import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ClinicSummarySchema, type ClinicPatch } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const updateClinic = (id: number, patch: ClinicPatch) =>
  apiFetch(`/api/admin/clinics/${id}`, ClinicSummarySchema, { method: 'PATCH', body: patch });

export function useUpdateClinic() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch }: { id: number; patch: ClinicPatch }) => updateClinic(id, patch),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.admin.clinics() }),
  });
}
