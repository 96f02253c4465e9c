import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { TrajectoryResponseSchema } from '../../../../shared/schemas/analytics';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getTrajectory = (episodeId: number, signal?: AbortSignal) =>
  apiFetch(`/api/analytics/episodes/${episodeId}/trajectory`, TrajectoryResponseSchema, { signal });

export const trajectoryQueryOptions = (episodeId: number) =>
  queryOptions({
    queryKey: queryKeys.analytics.trajectory(episodeId, {}),
    queryFn: ({ signal }) => getTrajectory(episodeId, signal),
    placeholderData: keepPreviousData,
  });

export const useTrajectory = (episodeId: number) => useQuery(trajectoryQueryOptions(episodeId));
