import { queryOptions, useQuery } from '@tanstack/react-query';
import { InterventionInfoListSchema } from '../../../../shared/schemas/reference';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getInterventions = (signal?: AbortSignal) =>
  apiFetch('/api/interventions', InterventionInfoListSchema, { signal });

export const interventionsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.reference.interventions(),
    queryFn: ({ signal }) => getInterventions(signal),
    staleTime: Infinity,
  });

export const useInterventions = () => useQuery(interventionsQueryOptions());
