import { and, asc, desc, eq, gte, ilike, lt, or, sql, type SQL } from 'drizzle-orm';
import type { AuditEvent, AuditQuery } from '../../../shared/schemas/admin';
import type { Db } from '../../db/client';
import { auditEvents, clinics, users } from '../../db/schema';
import type { Scope } from '../../db/scope';
import { ForbiddenError } from '../../errors';
import { iso } from './common';

/** Steward: every event. Lead: the events of their clinic. Nobody else reads the trail. */
function scopeCondition(scope: Scope): SQL | undefined {
  if (scope.kind === 'clinic') return eq(auditEvents.clinicId, scope.clinicId);
  if (scope.researcher) throw new ForbiddenError('The audit trail is for the steward and clinic leads');
  return undefined;
}

const likeEscape = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

const nextDay = (d: string) => new Date(Date.parse(`${d}T00:00:00Z`) + 86_400_000);

/** The filter of a query; dates are whole days in UTC, both ends included. */
export function auditWhere(scope: Scope, q: Omit<AuditQuery, 'limit' | 'offset'>): SQL | undefined {
  const actor = q.actor ? `%${likeEscape(q.actor)}%` : undefined;
  return and(
    scopeCondition(scope),
    actor ? or(ilike(users.name, actor), ilike(users.email, actor)) : undefined,
    q.action ? eq(auditEvents.action, q.action) : undefined,
    q.entity ? eq(auditEvents.entity, q.entity) : undefined,
    q.from ? gte(auditEvents.at, new Date(`${q.from}T00:00:00Z`)) : undefined,
    q.to ? lt(auditEvents.at, nextDay(q.to)) : undefined,
  );
}

const columns = {
  id: auditEvents.id,
  at: auditEvents.at,
  actorId: auditEvents.actorId,
  actorName: users.name,
  actorEmail: users.email,
  clinicId: auditEvents.clinicId,
  clinicCode: clinics.code,
  action: auditEvents.action,
  entity: auditEvents.entity,
  entityId: auditEvents.entityId,
  detail: auditEvents.detail,
};

/** Newest first, `limit` rows from `offset`, with the total for the pager. */
export async function listAudit(db: Db, scope: Scope, q: AuditQuery): Promise<{ items: AuditEvent[]; total: number }> {
  const where = auditWhere(scope, q);
  const base = () => db.select(columns).from(auditEvents).leftJoin(users, eq(users.id, auditEvents.actorId)).leftJoin(clinics, eq(clinics.id, auditEvents.clinicId));
  const [rows, [count]] = await Promise.all([
    base().where(where).orderBy(desc(auditEvents.at), desc(auditEvents.id)).limit(q.limit).offset(q.offset),
    db.select({ n: sql<number>`count(*)::int` }).from(auditEvents).leftJoin(users, eq(users.id, auditEvents.actorId)).where(where),
  ]);
  return { items: rows.map((r) => ({ ...r, at: iso(r.at)! })), total: count?.n ?? 0 };
}

/** The distinct actions and entities the caller can see, for the filter menus. */
export async function auditFacets(db: Db, scope: Scope): Promise<{ actions: string[]; entities: string[] }> {
  const where = scopeCondition(scope);
  const [actions, entities] = await Promise.all([
    db.selectDistinct({ v: auditEvents.action }).from(auditEvents).where(where).orderBy(asc(auditEvents.action)),
    db.selectDistinct({ v: auditEvents.entity }).from(auditEvents).where(where).orderBy(asc(auditEvents.entity)),
  ]);
  return { actions: actions.map((r) => r.v), entities: entities.map((r) => r.v) };
}

export const AUDIT_CSV_MAX_ROWS = 50_000;

/** Every event of a filtered view, oldest first (for the CSV download); at most AUDIT_CSV_MAX_ROWS + 1 rows. */
export async function auditRowsForCsv(db: Db, scope: Scope, q: Omit<AuditQuery, 'limit' | 'offset'>): Promise<AuditEvent[]> {
  const rows = await db
    .select(columns)
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .leftJoin(clinics, eq(clinics.id, auditEvents.clinicId))
    .where(auditWhere(scope, q))
    .orderBy(asc(auditEvents.at), asc(auditEvents.id))
    .limit(AUDIT_CSV_MAX_ROWS + 1);
  return rows.map((r) => ({ ...r, at: iso(r.at)! }));
}
