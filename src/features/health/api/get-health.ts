import { queryOptions, useQuery } from '@tanstack/react-query';
import { HealthSchema } from '../../../../shared/health';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getHealth = (signal?: AbortSignal) => apiFetch('/api/health', HealthSchema, { signal });

export const healthQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.health(), queryFn: ({ signal }) => getHealth(signal), staleTime: 60_000 });

export const useHealth = () => useQuery(healthQueryOptions());
