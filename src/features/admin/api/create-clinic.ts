import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ClinicSummarySchema, type ClinicCreate } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const createClinic = (input: ClinicCreate) =>
  apiFetch('/api/admin/clinics', ClinicSummarySchema, { method: 'POST', body: input });

export function useCreateClinic() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createClinic,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.admin.clinics() }),
  });
}
