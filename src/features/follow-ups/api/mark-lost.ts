import { useMutation, useQueryClient } from '@tanstack/react-query';
import { updateEpisode } from '../../episodes/api/update-episode';
import { queryKeys } from '../../../lib/query-keys';

/** The lead's decision on a proposal: the episode's own PATCH, with the version the proposal was made from. */
export const markLost = (episodeId: number, version: number) => updateEpisode(episodeId, { status: 'lost', version });

export function useMarkLost() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ episodeId, version }: { episodeId: number; version: number }) => markLost(episodeId, version),
    onSettled: async (_data, _error, { episodeId }) => {
      await client.invalidateQueries({ queryKey: queryKeys.followUps.all() });
      await client.invalidateQueries({ queryKey: queryKeys.episodes.detail(episodeId) });
      await client.invalidateQueries({ queryKey: queryKeys.episodes.lists() });
    },
  });
}
