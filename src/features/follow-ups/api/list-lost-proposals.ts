import { queryOptions, useQuery } from '@tanstack/react-query';
import { LostProposalListSchema } from '../../../../shared/schemas/follow-ups';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const listLostProposals = (signal?: AbortSignal) =>
  apiFetch('/api/follow-ups/lost-proposals', LostProposalListSchema, { signal });

export const lostProposalsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.followUps.lostProposals(), queryFn: ({ signal }) => listLostProposals(signal) });

export const useLostProposals = (enabled: boolean) => useQuery({ ...lostProposalsQueryOptions(), enabled });
