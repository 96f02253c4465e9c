import { queryOptions, useQuery } from '@tanstack/react-query';
import { ClinicListSchema } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export const listClinics = (signal?: AbortSignal) => apiFetch('/api/admin/clinics', ClinicListSchema, { signal });

export const clinicsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.admin.clinics(), queryFn: ({ signal }) => listClinics(signal) });

export const useAdminClinics = (enabled = true) => useQuery({ ...clinicsQueryOptions(), enabled });
