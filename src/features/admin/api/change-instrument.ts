import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  InstrumentSchema,
  type InstrumentCreate,
  type InstrumentPatch,
  type McidUpdate,
} from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Every change to an instrument: create, edit, MCID, retire or reinstate, delete. */
export type InstrumentChange =
  | { kind: 'create'; input: InstrumentCreate }
  | { kind: 'edit'; id: number; patch: InstrumentPatch }
  | { kind: 'mcid'; id: number; input: McidUpdate }
  | { kind: 'retire' | 'reinstate'; id: number }
  | { kind: 'delete'; id: number };

export function changeInstrument(c: InstrumentChange) {
  const base = '/api/admin/instruments';
  switch (c.kind) {
    case 'create':
      return apiFetch(base, InstrumentSchema, { method: 'POST', body: c.input });
    case 'edit':
      return apiFetch(`${base}/${c.id}`, InstrumentSchema, { method: 'PATCH', body: c.patch });
    case 'mcid':
      return apiFetch(`${base}/${c.id}/mcid`, InstrumentSchema, { method: 'PUT', body: c.input });
    case 'retire':
    case 'reinstate':
      return apiFetch(`${base}/${c.id}/${c.kind}`, InstrumentSchema, { method: 'POST' });
    case 'delete':
      return apiFetch(`${base}/${c.id}`, z.undefined(), { method: 'DELETE' });
  }
}

export function useChangeInstrument() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: changeInstrument,
    onSuccess: async () => {
      await client.invalidateQueries({ queryKey: queryKeys.admin.instruments() });
      await client.invalidateQueries({ queryKey: queryKeys.reference.instruments() });
    },
  });
}
