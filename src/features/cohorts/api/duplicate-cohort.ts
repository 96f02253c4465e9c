import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CohortDetailSchema } from '../../../../shared/schemas/cohort';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const duplicateCohort = (id: number) =>
  apiFetch(`/api/cohorts/${id}/duplicate`, CohortDetailSchema, { method: 'POST', body: {} });

export function useDuplicateCohort() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: duplicateCohort,
    onSuccess: (copy) => {
      qc.setQueryData(queryKeys.cohorts.detail(copy.id), copy);
      void qc.invalidateQueries({ queryKey: queryKeys.cohorts.list() });
    },
  });
}
