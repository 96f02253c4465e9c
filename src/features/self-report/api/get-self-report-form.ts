import { queryOptions, useQuery } from '@tanstack/react-query';
import { SelfReportFormSchema } from '../../../../shared/schemas/follow-ups';
import { ApiError, apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getSelfReportForm = (token: string, signal?: AbortSignal) =>
  apiFetch(`/api/self-report/${encodeURIComponent(token)}`, SelfReportFormSchema, { signal });

export const selfReportFormQueryOptions = (token: string) =>
  queryOptions({
    queryKey: queryKeys.selfReport.form(token),
    queryFn: ({ signal }) => getSelfReportForm(token, signal),
    // A used, expired or unknown link is an answer, not a hiccup: do not ask again.
    retry: (count, error) => !(error instanceof ApiError && error.status < 500) && count < 2,
    staleTime: Infinity,
  });

export const useSelfReportForm = (token: string) => useQuery(selfReportFormQueryOptions(token));
