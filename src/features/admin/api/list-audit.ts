import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { AuditListSchema, type AuditQuery } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { searchOf } from '../search-params';

export const listAudit = (q: AuditQuery, signal?: AbortSignal) =>
  apiFetch(`/api/audit?${searchOf(q)}`, AuditListSchema, { signal });

export const auditQueryOptions = (q: AuditQuery) =>
  queryOptions({
    queryKey: queryKeys.admin.auditList(q),
    queryFn: ({ signal }) => listAudit(q, signal),
    placeholderData: keepPreviousData,
  });

export const useAuditList = (q: AuditQuery) => useQuery(auditQueryOptions(q));

/** The address of the CSV of the same filtered view (paging left out: the file holds every match). */
export function auditCsvUrl(q: AuditQuery): string {
  const { limit: _l, offset: _o, ...filter } = q;
  return `/api/audit/export.csv?${searchOf(filter)}`;
}
