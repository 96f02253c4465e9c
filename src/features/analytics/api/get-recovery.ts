import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { RecoveryResponseSchema } from '../../../../shared/schemas/analytics';
import type { AnalyticsFilterParams } from '../../../../shared/schemas/analytics-filters';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { filterQueryString, readFilterParams } from '../filters';

export const getRecovery = (f: AnalyticsFilterParams, signal?: AbortSignal) =>
  apiFetch(`/api/analytics/recovery${filterQueryString(f)}`, RecoveryResponseSchema, { signal });

export const recoveryQueryOptions = (f: AnalyticsFilterParams) => {
  const used = readFilterParams(new URLSearchParams(filterQueryString(f)));
  return queryOptions({
    queryKey: queryKeys.analytics.recovery(used),
    queryFn: ({ signal }) => getRecovery(used, signal),
    // A new filter keeps the previous numbers on screen (dimmed) until the new ones arrive.
    placeholderData: keepPreviousData,
  });
};

export const useRecovery = (f: AnalyticsFilterParams) => useQuery(recoveryQueryOptions(f));
