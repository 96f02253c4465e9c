import { queryOptions, useQuery } from '@tanstack/react-query';
import { InstrumentInfoListSchema } from '../../../../shared/schemas/reference';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getInstruments = (signal?: AbortSignal) =>
  apiFetch('/api/instruments', InstrumentInfoListSchema, { signal });

// Reference rows change only when the steward edits them: keep them for the whole visit.
export const instrumentsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.reference.instruments(),
    queryFn: ({ signal }) => getInstruments(signal),
    staleTime: Infinity,
  });

export const useInstruments = () => useQuery(instrumentsQueryOptions());
