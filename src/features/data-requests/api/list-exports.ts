import { queryOptions, useQuery } from '@tanstack/react-query';
import { ExportLogSchema } from '../../../../shared/schemas/data-request';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const listExports = (signal?: AbortSignal) => apiFetch('/api/exports', ExportLogSchema, { signal });

export const exportsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.dataRequests.exports(), queryFn: ({ signal }) => listExports(signal) });

export const useExportsLog = () => useQuery(exportsQueryOptions());
