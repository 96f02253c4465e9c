import type { Db } from '../db/client';
import { auditEvents } from '../db/schema';

/** A database handle or an open transaction: audit events are written inside the caller's transaction. */
export type Tx = Db | Parameters<Parameters<Db['transaction']>[0]>[0];

export type AuditInput = {
  actorId: number | null;
  clinicId: number | null;
  action: string; // e.g. 'create', 'update', 'delete', 'upload', 'export', 'sign-in'
  entity: string; // e.g. 'episode', 'assessment', 'upload'
  entityId?: string | number | null;
  detail?: Record<string, unknown>;
};

/** Writes one audit event. Never put a password, token, session id or pseudonym in `detail`. */
export async function audit(tx: Tx, e: AuditInput): Promise<void> {
  await tx.insert(auditEvents).values({
    actorId: e.actorId,
    clinicId: e.clinicId,
    action: e.action,
    entity: e.entity,
    entityId: e.entityId == null ? null : String(e.entityId),
    detail: e.detail ?? {},
  });
}
