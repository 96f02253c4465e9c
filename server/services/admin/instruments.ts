import { asc, eq, sql } from 'drizzle-orm';
import type { Instrument, InstrumentCreate, InstrumentPatch, McidUpdate } from '../../../shared/schemas/admin';
import type { Db } from '../../db/client';
import { instruments, scores } from '../../db/schema';
import type { Scope } from '../../db/scope';
import { ConflictError, NotFoundError, ValidationError } from '../../errors';
import { audit, type Tx } from '../audit';
import { currentRules } from '../rules.service';
import { assertSteward, changesOf, isUniqueViolation, iso } from './common';

const usage = (tx: Tx) =>
  tx
    .select({
      instrumentId: scores.instrumentId,
      scoreCount: sql<number>`count(*)::int`.as('score_count'),
      storedMin: sql<number | null>`min(${scores.value})`.as('stored_min'),
      storedMax: sql<number | null>`max(${scores.value})`.as('stored_max'),
    })
    .from(scores)
    .groupBy(scores.instrumentId)
    .as('usage');

async function load(tx: Tx, id?: number, lock = false): Promise<Instrument[]> {
  const u = usage(tx);
  const q = tx
    .select({ i: instruments, scoreCount: u.scoreCount, storedMin: u.storedMin, storedMax: u.storedMax })
    .from(instruments)
    .leftJoin(u, eq(u.instrumentId, instruments.id))
    .where(id === undefined ? undefined : eq(instruments.id, id))
    .orderBy(asc(instruments.code));
  // The row lock conflicts with the key-share lock a new score takes, so the usage figures hold until commit.
  const rows = lock ? await q.for('update', { of: instruments }) : await q;
  return rows.map((r) => ({
    ...r.i,
    createdAt: iso(r.i.createdAt)!,
    scoreCount: r.scoreCount ?? 0,
    storedMin: r.storedMin == null ? null : Number(r.storedMin),
    storedMax: r.storedMax == null ? null : Number(r.storedMax),
  }));
}

async function loadOne(tx: Tx, id: number, lock = false): Promise<Instrument> {
  const [row] = await load(tx, id, lock);
  if (!row) throw new NotFoundError('No such instrument');
  return row;
}

export async function listInstruments(db: Db, scope: Scope) {
  assertSteward(scope);
  const items = await load(db);
  return { items, total: items.length };
}

export async function createInstrument(db: Db, scope: Scope, input: InstrumentCreate): Promise<Instrument> {
  assertSteward(scope);
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx.insert(instruments).values(input).returning({ id: instruments.id });
      await audit(tx, { actorId: scope.userId, clinicId: null, action: 'create', entity: 'instrument', entityId: row!.id, detail: { ...input } });
      return loadOne(tx, row!.id);
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw new ConflictError(`An instrument with the code ${input.code} already exists`);
    throw err;
  }
}

/** A range may grow, and may shrink only down to the stored scores; an instrument in use keeps its direction. */
function checkPatch(before: Instrument, next: Instrument, recoveryThreshold: number | null): void {
  if (next.max <= next.min) throw new ValidationError('The top of the range must be above its bottom', [{ path: ['max'], message: 'Above the bottom' }]);
  if (before.storedMin !== null && before.storedMax !== null && (next.min > before.storedMin || next.max < before.storedMax)) {
    throw new ValidationError(
      `The range of ${before.code} cannot shrink below its stored scores: they run from stored min ${before.storedMin} to stored max ${before.storedMax}`,
      [{ path: next.min > before.storedMin ? ['min'] : ['max'], message: `Stored scores run from ${before.storedMin} to ${before.storedMax}` }],
    );
  }
  if (before.scoreCount > 0 && next.higherIsBetter !== before.higherIsBetter) {
    throw new ValidationError(`${before.code} holds ${before.scoreCount} stored scores; its direction cannot change`, [{ path: ['higherIsBetter'], message: 'In use' }]);
  }
  if (next.mcid !== null && next.mcid > next.max - next.min) {
    throw new ValidationError('The MCID cannot exceed the range', [{ path: ['mcid'], message: 'Larger than the range' }]);
  }
  if (recoveryThreshold !== null && (recoveryThreshold < next.min || recoveryThreshold > next.max)) {
    throw new ValidationError(`The registry's recovery threshold ${recoveryThreshold} must stay inside the range of ${before.code}`, [{ path: ['min'], message: 'Would exclude the recovery threshold' }]);
  }
}

async function recoveryThresholdFor(db: Db, code: string): Promise<number | null> {
  const { rules } = await currentRules(db);
  return rules.recovery.instrumentCode === code ? rules.recovery.threshold : null;
}

type InstrumentSet = Partial<Omit<typeof instruments.$inferInsert, 'id' | 'createdAt'>>;

async function change(
  db: Db,
  scope: Scope,
  id: number,
  action: string,
  apply: (before: Instrument, threshold: number | null) => InstrumentSet | null,
  extraDetail: Record<string, unknown> = {},
): Promise<Instrument> {
  assertSteward(scope);
  return db.transaction(async (tx) => {
    const before = await loadOne(tx, id, true);
    const set = apply(before, await recoveryThresholdFor(db, before.code));
    if (!set) return before;
    const changes = changesOf(before as unknown as Record<string, unknown>, set);
    if (Object.keys(changes).length === 0) return before;
    await tx.update(instruments).set(set).where(eq(instruments.id, id));
    await audit(tx, { actorId: scope.userId, clinicId: null, action, entity: 'instrument', entityId: id, detail: { code: before.code, changes, ...extraDetail } });
    return loadOne(tx, id);
  });
}

export function updateInstrument(db: Db, scope: Scope, id: number, patch: InstrumentPatch) {
  return change(db, scope, id, 'update', (before, threshold) => {
    checkPatch(before, { ...before, ...patch }, threshold);
    return patch;
  });
}

/** A new MCID always records its published source (kept on the row and in the audit trail). */
export function setMcid(db: Db, scope: Scope, id: number, input: McidUpdate) {
  return change(db, scope, id, 'update-mcid', (before, threshold) => {
    checkPatch(before, { ...before, mcid: input.mcid }, threshold);
    return { mcid: input.mcid, mcidSource: input.source };
  });
}

/** Retired: kept with its scores, but takes no new ones. The current recovery instrument cannot retire. */
export function setRetired(db: Db, scope: Scope, id: number, retired: boolean) {
  return change(db, scope, id, retired ? 'retire' : 'reinstate', (before, threshold) => {
    if (before.retired === retired) throw new ConflictError(`${before.code} is already ${retired ? 'retired' : 'in service'}`);
    if (retired && threshold !== null) {
      throw new ValidationError(`${before.code} is the recovery instrument of the current rules; change the rules before retiring it`);
    }
    return { retired };
  });
}

/** Only an instrument that never held a score can be deleted; one in use can only be retired. */
export async function deleteInstrument(db: Db, scope: Scope, id: number): Promise<void> {
  assertSteward(scope);
  await db.transaction(async (tx) => {
    const before = await loadOne(tx, id, true);
    if (before.scoreCount > 0) {
      throw new ConflictError(`${before.code} holds ${before.scoreCount} stored scores and cannot be deleted; retire it instead`);
    }
    // Old rules versions must stay recomputable, so an instrument any version names is kept.
    const named = await tx.execute(sql`select 1 from registry_rules where rules->'recovery'->>'instrumentCode' = ${before.code} limit 1`);
    if (named.rows.length > 0 || (await recoveryThresholdFor(db, before.code)) !== null) {
      throw new ConflictError(`${before.code} is named by the registry rules and cannot be deleted; retire it instead`);
    }
    await tx.delete(instruments).where(eq(instruments.id, id));
    await audit(tx, { actorId: scope.userId, clinicId: null, action: 'delete', entity: 'instrument', entityId: id, detail: { code: before.code, label: before.label } });
  });
}
