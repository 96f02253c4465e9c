import { queryOptions, useQuery } from '@tanstack/react-query';
import { OutboxResponseSchema } from '../../../../shared/account';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getOutbox = (signal?: AbortSignal) => apiFetch('/api/dev/outbox', OutboxResponseSchema, { signal });

export const outboxQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.auth.outbox(), queryFn: ({ signal }) => getOutbox(signal), staleTime: 0 });

export const useOutbox = () => useQuery(outboxQueryOptions());
