import { queryOptions, useQuery } from '@tanstack/react-query';
import { CurrentRulesSchema } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Which registry rules version is in force (for any signed-in screen that shows numbers). */
export const getCurrentRules = (signal?: AbortSignal) => apiFetch('/api/rules/current', CurrentRulesSchema, { signal });

export const currentRulesQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.rules.current(), queryFn: ({ signal }) => getCurrentRules(signal) });

export const useCurrentRules = () => useQuery(currentRulesQueryOptions());
