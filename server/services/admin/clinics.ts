import { eq } from 'drizzle-orm';
import type { ClinicCreate, ClinicPatch, ClinicSummary } from '../../../shared/schemas/admin';
import type { Db } from '../../db/client';
import { clinics } from '../../db/schema';
import type { Scope } from '../../db/scope';
import { ConflictError, NotFoundError } from '../../errors';
import { audit, type Tx } from '../audit';
import { clinicSummaries } from './clinic-stats';
import { assertSteward, changesOf, isUniqueViolation } from './common';

export async function listClinics(db: Db, scope: Scope): Promise<{ items: ClinicSummary[]; total: number }> {
  assertSteward(scope);
  const items = await clinicSummaries(db);
  return { items, total: items.length };
}

export async function getClinic(db: Db, scope: Scope, id: number): Promise<ClinicSummary> {
  assertSteward(scope);
  const [row] = await clinicSummaries(db, id);
  if (!row) throw new NotFoundError('No such clinic');
  return row;
}

async function lockClinic(tx: Tx, id: number) {
  const [row] = await tx.select().from(clinics).where(eq(clinics.id, id)).for('update');
  if (!row) throw new NotFoundError('No such clinic');
  return row;
}

export async function createClinic(db: Db, scope: Scope, input: ClinicCreate): Promise<ClinicSummary> {
  assertSteward(scope);
  try {
    const id = await db.transaction(async (tx) => {
      // The pseudonym salt comes from the column's own default (fresh random bytes per clinic).
      const [row] = await tx.insert(clinics).values(input).returning({ id: clinics.id });
      await audit(tx, { actorId: scope.userId, clinicId: row!.id, action: 'create', entity: 'clinic', entityId: row!.id, detail: { ...input } });
      return row!.id;
    });
    return getClinic(db, scope, id);
  } catch (err) {
    if (isUniqueViolation(err)) throw new ConflictError(`A clinic with the code ${input.code} already exists`);
    throw err;
  }
}

export async function updateClinic(db: Db, scope: Scope, id: number, patch: ClinicPatch): Promise<ClinicSummary> {
  assertSteward(scope);
  await db.transaction(async (tx) => {
    const before = await lockClinic(tx, id);
    const changes = changesOf(before, patch);
    if (Object.keys(changes).length === 0) return; // nothing changed: nothing to write or audit
    await tx.update(clinics).set(patch).where(eq(clinics.id, id));
    await audit(tx, { actorId: scope.userId, clinicId: id, action: 'update', entity: 'clinic', entityId: id, detail: { changes } });
  });
  return getClinic(db, scope, id);
}

/**
 * Deactivating keeps every stored row; the clinic stops accepting submissions (see assertClinicAccepts)
 * and leaves peer comparisons from then on. Reactivating undoes both.
 */
export async function setClinicActive(db: Db, scope: Scope, id: number, active: boolean): Promise<ClinicSummary> {
  assertSteward(scope);
  await db.transaction(async (tx) => {
    const before = await lockClinic(tx, id);
    if (before.active === active) {
      throw new ConflictError(`Clinic ${before.code} is already ${active ? 'active' : 'deactivated'}`);
    }
    await tx.update(clinics).set({ active }).where(eq(clinics.id, id));
    await audit(tx, {
      actorId: scope.userId,
      clinicId: id,
      action: active ? 'reactivate' : 'deactivate',
      entity: 'clinic',
      entityId: id,
      detail: { code: before.code },
    });
  });
  return getClinic(db, scope, id);
}
