import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { DataRequestSchema, type DataRequestCreateSchema } from '../../../../shared/schemas/data-request';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export type DataRequestInput = z.input<typeof DataRequestCreateSchema>;

export const createDataRequest = (body: DataRequestInput) =>
  apiFetch('/api/data-requests', DataRequestSchema, { method: 'POST', body });

export function useCreateDataRequest() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createDataRequest,
    onSuccess: () => void qc.invalidateQueries({ queryKey: queryKeys.dataRequests.all() }),
  });
}
