import { queryOptions, useQuery } from '@tanstack/react-query';
import { CohortListSchema } from '../../../../shared/schemas/cohort';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const listCohorts = (signal?: AbortSignal) => apiFetch('/api/cohorts', CohortListSchema, { signal });

export const cohortsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.cohorts.list(), queryFn: ({ signal }) => listCohorts(signal) });

export const useCohorts = () => useQuery(cohortsQueryOptions());
