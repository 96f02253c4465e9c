import { queryOptions, useQuery } from '@tanstack/react-query';
import { PreferencesSchema } from '../../../../shared/schemas/follow-ups';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getPreferences = (signal?: AbortSignal) => apiFetch('/api/me/preferences', PreferencesSchema, { signal });

export const preferencesQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.preferences(), queryFn: ({ signal }) => getPreferences(signal) });

export const usePreferences = () => useQuery(preferencesQueryOptions());
