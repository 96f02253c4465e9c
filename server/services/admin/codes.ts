import { asc, eq, sql } from 'drizzle-orm';
import type { CodeCreate, CodeDecision, CodePatch, CodeProposal, InterventionCode } from '../../../shared/schemas/admin';
import type { Db } from '../../db/client';
import { clinics, episodeInterventions, interventionCodes } from '../../db/schema';
import type { Scope } from '../../db/scope';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../../errors';
import { audit, type Tx } from '../audit';
import { assertSteward, changesOf, isUniqueViolation, iso } from './common';

async function load(tx: Tx, where?: { id?: number; clinicId?: number }, lock = false): Promise<InterventionCode[]> {
  const uses = tx
    .select({ codeId: episodeInterventions.interventionCodeId, n: sql<number>`count(*)::int`.as('n') })
    .from(episodeInterventions)
    .groupBy(episodeInterventions.interventionCodeId)
    .as('uses');
  const cond =
    where?.id !== undefined ? eq(interventionCodes.id, where.id)
    : where?.clinicId !== undefined ? eq(interventionCodes.proposedByClinicId, where.clinicId)
    : undefined;
  const q = tx
    .select({ c: interventionCodes, clinicCode: clinics.code, useCount: uses.n })
    .from(interventionCodes)
    .leftJoin(clinics, eq(clinics.id, interventionCodes.proposedByClinicId))
    .leftJoin(uses, eq(uses.codeId, interventionCodes.id))
    .where(cond)
    .orderBy(asc(interventionCodes.kind), asc(interventionCodes.code));
  const rows = lock ? await q.for('update', { of: interventionCodes }) : await q;
  return rows.map((r) => ({ ...r.c, createdAt: iso(r.c.createdAt)!, proposedByClinicCode: r.clinicCode, useCount: r.useCount ?? 0 }));
}

async function loadOne(tx: Tx, id: number, lock = false): Promise<InterventionCode> {
  const [row] = await load(tx, { id }, lock);
  if (!row) throw new NotFoundError('No such intervention code');
  return row;
}

/** Steward: every code and proposal. Lead: the proposals of their own clinic. */
export async function listCodes(db: Db, scope: Scope) {
  const items = scope.kind === 'clinic' ? await load(db, { clinicId: scope.clinicId }) : (assertSteward(scope), await load(db));
  return { items, total: items.length };
}

async function insertCode(db: Db, scope: Scope, values: typeof interventionCodes.$inferInsert, action: string) {
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx.insert(interventionCodes).values(values).returning({ id: interventionCodes.id });
      await audit(tx, {
        actorId: scope.userId,
        clinicId: values.proposedByClinicId ?? null,
        action,
        entity: 'intervention-code',
        entityId: row!.id,
        detail: { code: values.code, label: values.label, kind: values.kind, graded: values.graded },
      });
      return loadOne(tx, row!.id);
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw new ConflictError(`The code ${values.code} already exists (accepted, proposed or declined)`);
    throw err;
  }
}

export function createCode(db: Db, scope: Scope, input: CodeCreate) {
  assertSteward(scope);
  return insertCode(db, scope, { ...input, status: 'accepted' }, 'create');
}

/** A lead proposes a code of their own clinic; it is unusable until the steward accepts it. */
export function proposeCode(db: Db, scope: Scope, input: CodeProposal) {
  if (scope.kind !== 'clinic') throw new ForbiddenError('Codes are proposed by a clinic lead');
  return insertCode(db, scope, { ...input, status: 'proposed', proposedByClinicId: scope.clinicId }, 'propose');
}

async function change(db: Db, scope: Scope, id: number, action: string, apply: (c: InterventionCode) => Partial<Omit<typeof interventionCodes.$inferInsert, 'id' | 'createdAt'>>, extra: Record<string, unknown> = {}) {
  assertSteward(scope);
  return db.transaction(async (tx) => {
    const before = await loadOne(tx, id, true);
    const set = apply(before);
    const changes = changesOf(before as unknown as Record<string, unknown>, set);
    if (Object.keys(changes).length === 0) return before;
    await tx.update(interventionCodes).set(set).where(eq(interventionCodes.id, id));
    await audit(tx, { actorId: scope.userId, clinicId: before.proposedByClinicId, action, entity: 'intervention-code', entityId: id, detail: { code: before.code, changes, ...extra } });
    return loadOne(tx, id);
  });
}

/** The label may change any time; grading only while no episode recorded the code (stored levels would lose meaning). */
export function updateCode(db: Db, scope: Scope, id: number, patch: CodePatch) {
  return change(db, scope, id, 'update', (before) => {
    if (patch.graded !== undefined && patch.graded !== before.graded && before.useCount > 0) {
      throw new ValidationError(`${before.code} is recorded on ${before.useCount} episodes; its grading cannot change`, [{ path: ['graded'], message: 'In use' }]);
    }
    return patch;
  });
}

export function decideProposal(db: Db, scope: Scope, id: number, input: CodeDecision) {
  const status = input.decision === 'accept' ? 'accepted' : 'declined';
  return change(
    db,
    scope,
    id,
    input.decision,
    (before) => {
      if (before.status !== 'proposed') throw new ConflictError(`${before.code} is not waiting for a decision (it is ${before.status})`);
      return { status };
    },
    input.note ? { note: input.note } : {},
  );
}
