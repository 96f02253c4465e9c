import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { AddOnsResponseSchema } from '../../../../shared/schemas/analytics';
import type { AnalyticsFilterParams } from '../../../../shared/schemas/analytics-filters';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { filterQueryString, readFilterParams } from '../filters';

/** The filters this endpoint uses (others would only split the cache). */
const ONLY = ['from', 'to', 'condition', 'instrument', 'clinic', 'subgroup', 'level'] as const;

export const getAddOns = (f: AnalyticsFilterParams, signal?: AbortSignal) =>
  apiFetch(`/api/analytics/addons${filterQueryString(f, ONLY)}`, AddOnsResponseSchema, { signal });

export const addonsQueryOptions = (f: AnalyticsFilterParams) => {
  const used = readFilterParams(new URLSearchParams(filterQueryString(f, ONLY)));
  return queryOptions({
    queryKey: queryKeys.analytics.addons(used),
    queryFn: ({ signal }) => getAddOns(used, signal),
    // A new filter keeps the previous numbers on screen (dimmed) until the new ones arrive.
    placeholderData: keepPreviousData,
  });
};

export const useAddOns = (f: AnalyticsFilterParams) => useQuery(addonsQueryOptions(f));
