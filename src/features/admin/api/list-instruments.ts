import { queryOptions, useQuery } from '@tanstack/react-query';
import { InstrumentListSchema } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const listInstruments = (signal?: AbortSignal) =>
  apiFetch('/api/admin/instruments', InstrumentListSchema, { signal });

export const instrumentsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.admin.instruments(), queryFn: ({ signal }) => listInstruments(signal) });

export const useAdminInstruments = () => useQuery(instrumentsQueryOptions());
