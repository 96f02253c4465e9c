import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PreferencesSchema, type Preferences } from '../../../../shared/schemas/follow-ups';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const updatePreferences = (p: Preferences) =>
  apiFetch('/api/me/preferences', PreferencesSchema, { method: 'PATCH', body: p });

export function useUpdatePreferences() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: updatePreferences,
    onSuccess: (p) => client.setQueryData(queryKeys.preferences(), p),
  });
}
