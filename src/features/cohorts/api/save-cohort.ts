import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CohortDetailSchema, type CohortSave } from '../../../../shared/schemas/cohort';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** A new cohort (POST) or, for a saved one, a new version of it (PUT). */
export const saveCohort = (id: number | null, body: CohortSave) =>
  apiFetch(id === null ? '/api/cohorts' : `/api/cohorts/${id}`, CohortDetailSchema, {
    method: id === null ? 'POST' : 'PUT',
    body,
  });

export function useSaveCohort(id: number | null) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CohortSave) => saveCohort(id, body),
    onSuccess: (saved) => {
      qc.setQueryData(queryKeys.cohorts.detail(saved.id), saved);
      void qc.invalidateQueries({ queryKey: queryKeys.cohorts.list() });
    },
  });
}
