import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  InterventionCodeSchema,
  type CodeCreate,
  type CodeDecision,
  type CodePatch,
} from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The steward's changes to the code list: add, edit, accept or decline a clinic's proposal. */
export type CodeChange =
  | { kind: 'create'; input: CodeCreate }
  | { kind: 'edit'; id: number; patch: CodePatch }
  | { kind: 'decide'; id: number; input: CodeDecision };

export function changeCode(c: CodeChange) {
  const base = '/api/admin/intervention-codes';
  if (c.kind === 'create') return apiFetch(base, InterventionCodeSchema, { method: 'POST', body: c.input });
  if (c.kind === 'edit') return apiFetch(`${base}/${c.id}`, InterventionCodeSchema, { method: 'PATCH', body: c.patch });
  return apiFetch(`${base}/${c.id}/decision`, InterventionCodeSchema, { method: 'POST', body: c.input });
}

export function useChangeCode() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: changeCode,
    onSuccess: async () => {
      await client.invalidateQueries({ queryKey: queryKeys.admin.codes() });
      await client.invalidateQueries({ queryKey: queryKeys.reference.interventions() });
    },
  });
}
