import { queryOptions, useQuery } from '@tanstack/react-query';
import { AuditFacetsSchema } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The actions and entities that occur in the caller's part of the trail, for the filter menus. */
export const getAuditFacets = (signal?: AbortSignal) => apiFetch('/api/audit/facets', AuditFacetsSchema, { signal });

export const auditFacetsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.admin.auditFacets(),
    queryFn: ({ signal }) => getAuditFacets(signal),
    staleTime: 60_000,
  });

export const useAuditFacets = () => useQuery(auditFacetsQueryOptions());
