import { queryOptions, useQuery } from '@tanstack/react-query';
import { CompletenessSchema } from '../../../../shared/schemas/follow-ups';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getCompleteness = (signal?: AbortSignal) =>
  apiFetch('/api/follow-ups/completeness', CompletenessSchema, { signal });

export const completenessQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.followUps.completeness(), queryFn: ({ signal }) => getCompleteness(signal) });

export const useCompleteness = (enabled: boolean) => useQuery({ ...completenessQueryOptions(), enabled });
