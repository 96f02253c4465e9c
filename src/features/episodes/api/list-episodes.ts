import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { EpisodeListSchema, type EpisodeListQuery } from '../../../../shared/schemas/episode';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The query string of a list request; empty filters are left out. */
export function episodeListSearch(q: EpisodeListQuery): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(q)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  return params.toString();
}

export const listEpisodes = (q: EpisodeListQuery, signal?: AbortSignal) =>
  apiFetch(`/api/episodes?${episodeListSearch(q)}`, EpisodeListSchema, { signal });

export const episodeListQueryOptions = (q: EpisodeListQuery) =>
  queryOptions({
    queryKey: queryKeys.episodes.list(q),
    queryFn: ({ signal }) => listEpisodes(q, signal),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useEpisodeList = (q: EpisodeListQuery) => useQuery(episodeListQueryOptions(q));
