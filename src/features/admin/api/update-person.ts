import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PersonSchema, type PersonPatch } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const updatePerson = (id: number, patch: PersonPatch) =>
  apiFetch(`/api/admin/people/${id}`, PersonSchema, { method: 'PATCH', body: patch });

export function useUpdatePerson() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch }: { id: number; patch: PersonPatch }) => updatePerson(id, patch),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.admin.all() }),
  });
}
