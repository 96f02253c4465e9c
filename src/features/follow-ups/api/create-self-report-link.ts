import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FollowUpTimepoint } from '../../../../shared/follow-up-schedule';
import { SelfReportLinkSchema } from '../../../../shared/schemas/follow-ups';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const createSelfReportLink = (episodeId: number, timepoint: FollowUpTimepoint) =>
  apiFetch(`/api/episodes/${episodeId}/self-report-links`, SelfReportLinkSchema, {
    method: 'POST',
    body: { timepoint },
  });

export function useCreateSelfReportLink() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ episodeId, timepoint }: { episodeId: number; timepoint: FollowUpTimepoint }) =>
      createSelfReportLink(episodeId, timepoint),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.followUps.lists() }),
  });
}
