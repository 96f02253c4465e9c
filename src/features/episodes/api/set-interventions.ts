import { useMutation, useQueryClient } from '@tanstack/react-query';
import { EpisodeDetailSchema, type InterventionsPut } from '../../../../shared/schemas/episode';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Replaces the episode's whole list of interventions. */
export const setInterventions = (episodeId: number, body: InterventionsPut) =>
  apiFetch(`/api/episodes/${episodeId}/interventions`, EpisodeDetailSchema, { method: 'PUT', body });

export function useSetInterventions(episodeId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: InterventionsPut) => setInterventions(episodeId, body),
    onSuccess: (episode) => {
      client.setQueryData(queryKeys.episodes.detail(episodeId), episode);
      return client.invalidateQueries({ queryKey: queryKeys.episodes.lists() });
    },
  });
}
