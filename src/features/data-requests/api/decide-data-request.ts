import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { DataRequestSchema, type DataRequestApproveSchema } from '../../../../shared/schemas/data-request';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export type Decision =
  | { kind: 'approve'; id: number; body: z.input<typeof DataRequestApproveSchema> }
  | { kind: 'decline'; id: number; body: { reason: string } };

/** The steward's decision on one request: approve (with conditions) or decline (with a reason). */
export const decideDataRequest = (d: Decision) =>
  apiFetch(`/api/data-requests/${d.id}/${d.kind}`, DataRequestSchema, { method: 'POST', body: d.body });

export function useDecideDataRequest() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: decideDataRequest,
    onSuccess: () => void qc.invalidateQueries({ queryKey: queryKeys.dataRequests.all() }),
  });
}
