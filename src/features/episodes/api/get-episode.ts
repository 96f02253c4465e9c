import { queryOptions, useQuery } from '@tanstack/react-query';
import { EpisodeDetailSchema } from '../../../../shared/schemas/episode';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getEpisode = (id: number, signal?: AbortSignal) =>
  apiFetch(`/api/episodes/${id}`, EpisodeDetailSchema, { signal });

export const episodeQueryOptions = (id: number) =>
  queryOptions({ queryKey: queryKeys.episodes.detail(id), queryFn: ({ signal }) => getEpisode(id, signal) });

// An address without a usable id never reaches the server.
export const useEpisode = (id: number) =>
  useQuery({ ...episodeQueryOptions(id), enabled: Number.isInteger(id) && id > 0 });
