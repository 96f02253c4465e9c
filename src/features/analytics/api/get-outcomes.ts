import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { OutcomesResponseSchema } from '../../../../shared/schemas/analytics';
import type { AnalyticsFilterParams } from '../../../../shared/schemas/analytics-filters';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { filterQueryString, readFilterParams } from '../filters';

/** The filters this endpoint uses (others would only split the cache). */
const ONLY = ['from', 'to', 'condition', 'instrument', 'clinic', 'subgroup', 'level'] as const;

export const getOutcomes = (f: AnalyticsFilterParams, signal?: AbortSignal) =>
  apiFetch(`/api/analytics/outcomes${filterQueryString(f, ONLY)}`, OutcomesResponseSchema, { signal });

export const outcomesQueryOptions = (f: AnalyticsFilterParams) => {
  const used = readFilterParams(new URLSearchParams(filterQueryString(f, ONLY)));
  return queryOptions({
    queryKey: queryKeys.analytics.outcomes(used),
    queryFn: ({ signal }) => getOutcomes(used, signal),
    // A new filter keeps the previous numbers on screen (dimmed) until the new ones arrive.
    placeholderData: keepPreviousData,
  });
};

export const useOutcomes = (f: AnalyticsFilterParams) => useQuery(outcomesQueryOptions(f));
