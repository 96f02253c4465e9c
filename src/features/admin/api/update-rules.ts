import { useMutation, useQueryClient } from '@tanstack/react-query';
import { RulesVersionSchema, type RulesUpdate } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const updateRules = (input: RulesUpdate) =>
  apiFetch('/api/admin/rules', RulesVersionSchema, { method: 'PUT', body: input });

/** A new rules version: every screen's numbers may change, so cached answers are dropped. */
export function useUpdateRules() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: updateRules,
    onSuccess: async () => {
      await client.invalidateQueries({ queryKey: queryKeys.admin.rules() });
      await client.invalidateQueries({ queryKey: queryKeys.rules.current() });
      // Dashboards keep their own keys; after a rules change none of them may show old numbers.
      await client.invalidateQueries({ predicate: (q) => q.queryKey[0] !== 'admin' && q.queryKey[0] !== 'auth' });
    },
  });
}
