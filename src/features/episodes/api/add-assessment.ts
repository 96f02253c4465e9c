import { useMutation, useQueryClient } from '@tanstack/react-query';
import { EpisodeDetailSchema, type AssessmentInput } from '../../../../shared/schemas/episode';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const addAssessment = (episodeId: number, input: AssessmentInput) =>
  apiFetch(`/api/episodes/${episodeId}/assessments`, EpisodeDetailSchema, { method: 'POST', body: input });

export function useAddAssessment(episodeId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: AssessmentInput) => addAssessment(episodeId, input),
    onSuccess: (episode) => {
      client.setQueryData(queryKeys.episodes.detail(episodeId), episode);
      return client.invalidateQueries({ queryKey: queryKeys.episodes.lists() });
    },
  });
}
