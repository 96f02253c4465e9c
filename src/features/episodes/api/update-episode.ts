import { useMutation, useQueryClient } from '@tanstack/react-query';
import { EpisodeDetailSchema, type EpisodePatch } from '../../../../shared/schemas/episode';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** A change with the version it was made against; the server answers 409 when someone changed it since. */
export const updateEpisode = (id: number, patch: EpisodePatch) =>
  apiFetch(`/api/episodes/${id}`, EpisodeDetailSchema, { method: 'PATCH', body: patch });

export function useUpdateEpisode(id: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (patch: EpisodePatch) => updateEpisode(id, patch),
    onSuccess: (episode) => {
      client.setQueryData(queryKeys.episodes.detail(id), episode);
      return client.invalidateQueries({ queryKey: queryKeys.episodes.lists() });
    },
  });
}
