import { queryOptions, useQuery } from '@tanstack/react-query';
import { RulesAdminSchema } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The rules in force and every earlier version, newest first. */
export const getRules = (signal?: AbortSignal) => apiFetch('/api/admin/rules', RulesAdminSchema, { signal });

export const rulesQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.admin.rules(), queryFn: ({ signal }) => getRules(signal) });

export const useAdminRules = () => useQuery(rulesQueryOptions());
