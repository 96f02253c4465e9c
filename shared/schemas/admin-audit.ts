import { z } from 'zod';
import { IsoDateSchema, listOf } from './episode';

const timestamp = z.string();

// ---------- audit trail ----------

export const AuditQuerySchema = z.object({
  actor: z.string().trim().max(120).optional(),
  action: z.string().trim().max(60).optional(),
  entity: z.string().trim().max(60).optional(),
  from: IsoDateSchema.optional(),
  to: IsoDateSchema.optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).default(0),
}).refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], message: 'The end date must be on or after the start date' });
export type AuditQuery = z.infer<typeof AuditQuerySchema>;

export const AuditEventSchema = z.object({
  id: z.number().int(),
  at: timestamp,
  actorId: z.number().int().nullable(),
  actorName: z.string().nullable(),
  actorEmail: z.string().nullable(),
  clinicId: z.number().int().nullable(),
  clinicCode: z.string().nullable(),
  action: z.string(),
  entity: z.string(),
  entityId: z.string().nullable(),
  detail: z.record(z.string(), z.unknown()),
});
export type AuditEvent = z.infer<typeof AuditEventSchema>;
export const AuditListSchema = listOf(AuditEventSchema);

export const AuditFacetsSchema = z.object({ actions: z.array(z.string()), entities: z.array(z.string()) });
