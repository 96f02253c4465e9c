import { queryOptions, useQuery } from '@tanstack/react-query';
import { CohortDetailSchema } from '../../../../shared/schemas/cohort';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getCohort = (id: number, signal?: AbortSignal) =>
  apiFetch(`/api/cohorts/${id}`, CohortDetailSchema, { signal });

export const cohortQueryOptions = (id: number) =>
  queryOptions({ queryKey: queryKeys.cohorts.detail(id), queryFn: ({ signal }) => getCohort(id, signal) });

/** One saved cohort with its versions; `id` null (a new cohort) asks for nothing. */
export const useCohort = (id: number | null) => useQuery({ ...cohortQueryOptions(id ?? 0), enabled: id !== null });
