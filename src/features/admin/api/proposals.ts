import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  InterventionCodeListSchema,
  InterventionCodeSchema,
  type CodeProposal,
} from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** A clinic lead's proposals of the clinic's own codes, and their fate. */
export const listProposals = (signal?: AbortSignal) =>
  apiFetch('/api/intervention-codes/proposals', InterventionCodeListSchema, { signal });

export const proposalsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.admin.proposals(), queryFn: ({ signal }) => listProposals(signal) });

export const useProposals = (enabled = true) => useQuery({ ...proposalsQueryOptions(), enabled });

export const proposeCode = (input: CodeProposal) =>
  apiFetch('/api/intervention-codes/proposals', InterventionCodeSchema, { method: 'POST', body: input });

export function useProposeCode() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: proposeCode,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.admin.proposals() }),
  });
}
