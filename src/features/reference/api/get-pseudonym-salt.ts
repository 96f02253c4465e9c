import { queryOptions, useQuery } from '@tanstack/react-query';
import { PseudonymSaltSchema } from '../../../../shared/schemas/reference';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const getPseudonymSalt = (signal?: AbortSignal) =>
  apiFetch('/api/clinics/current/pseudonym-salt', PseudonymSaltSchema, { signal });

export const pseudonymSaltQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.pseudonymSalt(),
    queryFn: ({ signal }) => getPseudonymSalt(signal),
    staleTime: Infinity,
  });

export const usePseudonymSalt = () => useQuery(pseudonymSaltQueryOptions());
