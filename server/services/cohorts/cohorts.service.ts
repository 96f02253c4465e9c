import { and, desc, eq, sql } from 'drizzle-orm';
import {
  CohortCriteriaSchema,
  type CohortCriteria,
  type CohortDetail,
  type CohortSave,
  type CohortSummary,
} from '../../../shared/schemas/cohort';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { cohorts, cohortVersions, users } from '../../db/schema';
import { ForbiddenError, NotFoundError } from '../../errors';
import { audit } from '../audit';
import { currentRules } from '../rules.service';
import { assertRegistry } from './access';
import { countCohorts } from './evaluate';
import { assertKnownCodes, loadReference } from './reference';
import { countChange, suppressionFor } from './small-cells';

type RegistryScope = Extract<Scope, { kind: 'registry' }>;

/** A researcher sees their own cohorts; the steward sees everyone's (to review data requests). */
const visibleTo = (scope: RegistryScope) => (scope.researcher ? eq(cohorts.ownerId, scope.userId) : sql`true`);

async function currentRows(db: Db, scope: RegistryScope, id?: number) {
  return db
    .select({ cohort: cohorts, version: cohortVersions, ownerName: users.name })
    .from(cohorts)
    .innerJoin(
      cohortVersions,
      and(eq(cohortVersions.cohortId, cohorts.id), eq(cohortVersions.version, cohorts.currentVersion)),
    )
    .innerJoin(users, eq(users.id, cohorts.ownerId))
    .where(and(visibleTo(scope), id === undefined ? sql`true` : eq(cohorts.id, id)))
    .orderBy(desc(cohorts.updatedAt), desc(cohorts.id));
}

/** Saved cohorts with the count at save and the count on today's data (one pass for the whole list). */
export async function listCohorts(db: Db, scope: Scope): Promise<{ items: CohortSummary[]; total: number }> {
  assertRegistry(scope);
  const rows = await currentRows(db, scope);
  const [ref, { rules }] = await Promise.all([loadReference(db), currentRules(db)]);
  const criteria = rows.map((r) => CohortCriteriaSchema.parse(r.version.criteria));
  const now = await countCohorts(db, ref, rules, criteria);
  const s = suppressionFor(scope, rules);
  const items = rows.map((r, i): CohortSummary => {
    const countNow = now[i]?.count ?? 0;
    return {
      id: r.cohort.id,
      name: r.cohort.name,
      description: r.cohort.description,
      currentVersion: r.cohort.currentVersion,
      mine: r.cohort.ownerId === scope.userId,
      ownerName: r.ownerName,
      duplicatedFromId: r.cohort.duplicatedFromId,
      countAtSave: s.cell(r.version.countAtSave),
      countNow: s.cell(countNow),
      change: countChange(s, r.version.countAtSave, countNow),
      savedAt: r.version.savedAt.toISOString(),
    };
  });
  return { items, total: items.length };
}

export async function getCohort(db: Db, scope: Scope, id: number): Promise<CohortDetail> {
  assertRegistry(scope);
  const [row] = await currentRows(db, scope, id);
  if (!row) throw new NotFoundError('No such cohort');
  const [ref, { rules }, versions] = await Promise.all([
    loadReference(db),
    currentRules(db),
    db.select().from(cohortVersions).where(eq(cohortVersions.cohortId, id)).orderBy(desc(cohortVersions.version)),
  ]);
  const criteria = CohortCriteriaSchema.parse(row.version.criteria);
  const [now] = await countCohorts(db, ref, rules, [criteria]);
  const s = suppressionFor(scope, rules);
  const countNow = now?.count ?? 0;
  return {
    id,
    name: row.cohort.name,
    description: row.cohort.description,
    currentVersion: row.cohort.currentVersion,
    mine: row.cohort.ownerId === scope.userId,
    ownerName: row.ownerName,
    duplicatedFromId: row.cohort.duplicatedFromId,
    countAtSave: s.cell(row.version.countAtSave),
    countNow: s.cell(countNow),
    change: countChange(s, row.version.countAtSave, countNow),
    savedAt: row.version.savedAt.toISOString(),
    criteria,
    versions: versions.map((v) => ({
      version: v.version,
      criteria: CohortCriteriaSchema.parse(v.criteria),
      countAtSave: s.cell(v.countAtSave),
      savedAt: v.savedAt.toISOString(),
      rulesVersion: v.rulesVersion,
    })),
  };
}

/** Validates the codes and counts the cohort on today's data: the count stored with the version. */
async function countForSave(db: Db, criteria: CohortCriteria) {
  const [ref, { version, rules }] = await Promise.all([loadReference(db), currentRules(db)]);
  assertKnownCodes(ref, criteria);
  const [c] = await countCohorts(db, ref, rules, [criteria]);
  return { count: c?.count ?? 0, clinics: c?.clinics ?? 0, rulesVersion: version };
}

export async function createCohort(
  db: Db,
  scope: Scope,
  input: CohortSave,
  duplicatedFromId: number | null = null,
): Promise<CohortDetail> {
  assertRegistry(scope);
  const counted = await countForSave(db, input.criteria);
  const id = await db.transaction(async (tx) => {
    const [c] = await tx
      .insert(cohorts)
      .values({ ownerId: scope.userId, name: input.name, description: input.description, duplicatedFromId })
      .returning({ id: cohorts.id });
    await tx.insert(cohortVersions).values({
      cohortId: c!.id,
      version: 1,
      criteria: input.criteria,
      countAtSave: counted.count,
      clinicsAtSave: counted.clinics,
      rulesVersion: counted.rulesVersion,
      savedBy: scope.userId,
    });
    await audit(tx, {
      actorId: scope.userId,
      clinicId: null,
      action: duplicatedFromId ? 'duplicate' : 'create',
      entity: 'cohort',
      entityId: c!.id,
      detail: { version: 1, countAtSave: counted.count, duplicatedFromId },
    });
    return c!.id;
  });
  return getCohort(db, scope, id);
}

/** A save of an existing cohort keeps the old criteria: it adds version n+1. Only the owner can save. */
export async function saveCohortVersion(db: Db, scope: Scope, id: number, input: CohortSave): Promise<CohortDetail> {
  assertRegistry(scope);
  const [existing] = await currentRows(db, scope, id);
  if (!existing) throw new NotFoundError('No such cohort');
  if (existing.cohort.ownerId !== scope.userId)
    throw new ForbiddenError('Only the owner can change a cohort; duplicate it instead');
  const counted = await countForSave(db, input.criteria);
  await db.transaction(async (tx) => {
    const [locked] = await tx.select().from(cohorts).where(eq(cohorts.id, id)).for('update');
    const version = locked!.currentVersion + 1;
    await tx.insert(cohortVersions).values({
      cohortId: id,
      version,
      criteria: input.criteria,
      countAtSave: counted.count,
      clinicsAtSave: counted.clinics,
      rulesVersion: counted.rulesVersion,
      savedBy: scope.userId,
    });
    await tx
      .update(cohorts)
      .set({ name: input.name, description: input.description, currentVersion: version, updatedAt: new Date() })
      .where(eq(cohorts.id, id));
    await audit(tx, {
      actorId: scope.userId,
      clinicId: null,
      action: 'update',
      entity: 'cohort',
      entityId: id,
      detail: { version, countAtSave: counted.count },
    });
  });
  return getCohort(db, scope, id);
}

/** A copy owned by the caller, starting at version 1 with the current criteria. */
export async function duplicateCohort(db: Db, scope: Scope, id: number, name?: string): Promise<CohortDetail> {
  assertRegistry(scope);
  const [source] = await currentRows(db, scope, id);
  if (!source) throw new NotFoundError('No such cohort');
  const criteria = CohortCriteriaSchema.parse(source.version.criteria);
  const copyName = name ?? `${source.cohort.name} (copy)`.slice(0, 120);
  return createCohort(db, scope, { name: copyName, description: source.cohort.description, criteria }, id);
}
