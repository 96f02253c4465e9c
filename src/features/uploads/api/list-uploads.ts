import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { UploadListSchema } from '../../../../shared/schemas/upload';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export type UploadPage = { limit: number; offset: number };

export const listUploads = ({ limit, offset }: UploadPage, signal?: AbortSignal) =>
  apiFetch(`/api/uploads?limit=${limit}&offset=${offset}`, UploadListSchema, { signal });

export const uploadListQueryOptions = (page: UploadPage) =>
  queryOptions({
    queryKey: queryKeys.uploads.list(page),
    queryFn: ({ signal }) => listUploads(page, signal),
    placeholderData: keepPreviousData,
  });

export const useUploadList = (page: UploadPage) => useQuery(uploadListQueryOptions(page));

/** The blank template with the columns and two invented example rows. */
export const UPLOAD_TEMPLATE_URL = '/api/uploads/template.csv';
