import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { CohortPreviewSchema, type CohortCriteriaInput } from '../../../../shared/schemas/cohort';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** A POST because the criteria are a body, but it changes nothing: cached like a read. */
export const previewCohort = (criteria: CohortCriteriaInput, signal?: AbortSignal) =>
  apiFetch('/api/cohorts/preview', CohortPreviewSchema, { method: 'POST', body: { criteria }, signal });

export const cohortPreviewQueryOptions = (criteria: CohortCriteriaInput) =>
  queryOptions({
    queryKey: queryKeys.cohorts.preview(criteria),
    queryFn: ({ signal }) => previewCohort(criteria, signal),
    // The last preview stays on screen while the next one is computed.
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });

export const useCohortPreview = (criteria: CohortCriteriaInput) => useQuery(cohortPreviewQueryOptions(criteria));
