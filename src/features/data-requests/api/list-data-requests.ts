import { queryOptions, useQuery } from '@tanstack/react-query';
import { DataRequestListSchema } from '../../../../shared/schemas/data-request';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const listDataRequests = (signal?: AbortSignal) =>
  apiFetch('/api/data-requests', DataRequestListSchema, { signal });

export const dataRequestsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.dataRequests.list(), queryFn: ({ signal }) => listDataRequests(signal) });

export const useDataRequests = () => useQuery(dataRequestsQueryOptions());
