import { useMutation, useQueryClient } from '@tanstack/react-query';
import { EpisodeDetailSchema, type EpisodeCreate } from '../../../../shared/schemas/episode';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const createEpisode = (input: EpisodeCreate) =>
  apiFetch('/api/episodes', EpisodeDetailSchema, { method: 'POST', body: input });

export function useCreateEpisode() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createEpisode,
    onSuccess: (episode) => {
      client.setQueryData(queryKeys.episodes.detail(episode.id), episode);
      return client.invalidateQueries({ queryKey: queryKeys.episodes.lists() });
    },
  });
}
