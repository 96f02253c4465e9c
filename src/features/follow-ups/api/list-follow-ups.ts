import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { FollowUpListSchema, type FollowUpListQuery } from '../../../../shared/schemas/follow-ups';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export type FollowUpFilters = {
  state: string;
  sort: NonNullable<FollowUpListQuery['sort']>;
  order: 'asc' | 'desc';
  limit: number;
  offset: number;
};

export const listFollowUps = (f: FollowUpFilters, signal?: AbortSignal) => {
  const q = new URLSearchParams({
    state: f.state,
    sort: f.sort,
    order: f.order,
    limit: String(f.limit),
    offset: String(f.offset),
  });
  return apiFetch(`/api/follow-ups?${q}`, FollowUpListSchema, { signal });
};

export const followUpsQueryOptions = (f: FollowUpFilters) =>
  queryOptions({
    queryKey: queryKeys.followUps.list(f),
    queryFn: ({ signal }) => listFollowUps(f, signal),
    placeholderData: keepPreviousData,
  });

export const useFollowUps = (f: FollowUpFilters) => useQuery(followUpsQueryOptions(f));
