import { queryOptions, useQuery } from '@tanstack/react-query';
import { InterventionCodeListSchema } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The steward's full list of codes and proposals. */
export const listCodes = (signal?: AbortSignal) =>
  apiFetch('/api/admin/intervention-codes', InterventionCodeListSchema, { signal });

export const codesQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.admin.codes(), queryFn: ({ signal }) => listCodes(signal) });

export const useAdminCodes = (enabled = true) => useQuery({ ...codesQueryOptions(), enabled });
