import { and, eq, sql } from 'drizzle-orm';
import type { EpisodeCreate, EpisodeDetail, EpisodePatch } from '../../shared/schemas/episode';
import type { Db } from '../db/client';
import type { Scope } from '../db/scope';
import { assessments, episodeInterventions, episodes, scores } from '../db/schema';
import { ConflictError, ValidationError } from '../errors';
import { audit, type Tx } from './audit';
import { assertClinicAccepts } from './clinics.service';
import { assessmentDateProblem, episodeStateProblems } from './episodes-rules';
import { episodeInScope, pgCode, writableClinic } from './episodes-scope';
import { getEpisode } from './episodes.service';
import { resolveInterventions, scoreProblems, type FieldProblem } from './reference-checks';
import { loadReferenceData, type ReferenceData } from './reference.service';

/** Problems become one 422 whose issues name the field, like a ZodError would. */
export function throwIfProblems(problems: FieldProblem[], prefix: string[], message: string): void {
  if (problems.length === 0) return;
  throw new ValidationError(problems.length === 1 ? problems[0]!.message : message, problems.map((p) => ({
    path: [...prefix, ...(p.field ? [p.field] : [])],
    message: p.message,
    code: 'custom',
  })));
}

export function conflictOnDuplicate(err: unknown, message: string): never {
  if (pgCode(err) === '23505') throw new ConflictError(message);
  throw err;
}

/** Writes the scores of one assessment (already checked against `ref`). */
export async function insertScores(tx: Tx, assessmentId: number, values: Record<string, number>, ref: ReferenceData) {
  const rows = Object.entries(values).map(([code, value]) => ({ assessmentId, instrumentId: ref.instruments.get(code)!.id, value }));
  if (rows.length > 0) await tx.insert(scores).values(rows);
}

/** A new episode with its baseline and interventions, in one transaction with its audit event. */
export async function createEpisode(db: Db, scope: Scope, input: EpisodeCreate): Promise<EpisodeDetail> {
  const clinicId = writableClinic(scope);
  const ref = await loadReferenceData(db);
  const problems: FieldProblem[] = [];
  if (!ref.conditions.has(input.conditionCode)) problems.push({ field: 'conditionCode', message: `Unknown condition “${input.conditionCode}”` });
  const dateProblem = assessmentDateProblem('baseline', input.baseline.assessedOn, input.startDate, null);
  if (dateProblem) problems.push({ field: 'baseline.assessedOn', message: dateProblem });
  for (const p of scoreProblems(input.baseline.scores, ref)) problems.push({ field: `baseline.scores.${p.field}`, message: p.message });
  const { resolved, problems: ip } = resolveInterventions(input.interventions, ref);
  for (const p of ip) problems.push({ field: `interventions.${p.field}`, message: p.message });
  throwIfProblems(problems, [], 'Some fields are not valid');

  const id = await db
    .transaction(async (tx) => {
      await assertClinicAccepts(tx, clinicId); // a deactivated clinic accepts nothing new
      const { baseline, interventions: _i, ...fields } = input;
      const [e] = await tx
        .insert(episodes)
        .values({ ...fields, clinicId, createdBy: scope.userId, updatedBy: scope.userId })
        .returning({ id: episodes.id });
      const [a] = await tx
        .insert(assessments)
        .values({
          episodeId: e!.id,
          assessedOn: baseline.assessedOn,
          timepoint: 'baseline',
          reporter: baseline.reporter,
          avgDailySteps: baseline.avgDailySteps ?? null,
          adverseEvent: baseline.adverseEvent || null,
          createdBy: scope.userId,
        })
        .returning({ id: assessments.id });
      await insertScores(tx, a!.id, baseline.scores, ref);
      if (resolved.length > 0) {
        await tx.insert(episodeInterventions).values(
          resolved.map((r) => ({ episodeId: e!.id, interventionCodeId: r.codeId, startWeek: r.startWeek, maxLevel: r.maxLevel })),
        );
      }
      await audit(tx, {
        actorId: scope.userId,
        clinicId,
        action: 'create',
        entity: 'episode',
        entityId: e!.id,
        detail: { reference: input.reference, baselineOn: baseline.assessedOn, instruments: Object.keys(baseline.scores), interventions: resolved.map((r) => r.code) },
      });
      return e!.id;
    })
    .catch((err: unknown) => conflictOnDuplicate(err, `Your clinic already has an episode with the reference “${input.reference}”`));
  return getEpisode(db, scope, id);
}

type EpisodeRow = typeof episodes.$inferSelect;
const PATCHABLE = [
  'pseudonym', 'reference', 'conditionCode', 'side', 'startDate', 'symptomWeeks', 'ageYears', 'sex', 'heightCm', 'weightKg',
  'activityProfile', 'standingWork', 'researchConsent', 'status', 'dischargeDate', 'dischargeReason',
] as const satisfies readonly (keyof EpisodeRow)[];

/** The audit's view of a change: old and new values, except the pseudonym (only that it changed). */
export function describeChanges(before: Partial<EpisodeRow>, after: Partial<EpisodeRow>, fields: readonly (keyof EpisodeRow)[]) {
  const changes: Record<string, unknown> = {};
  for (const f of fields) {
    if (before[f] === after[f]) continue;
    changes[f] = f === 'pseudonym' ? { changed: true } : { from: before[f] ?? null, to: after[f] ?? null };
  }
  return changes;
}

/** Changes an episode under optimistic locking: the caller's `version` must be the stored one (else 409). */
export async function patchEpisode(db: Db, scope: Scope, id: number, patch: EpisodePatch): Promise<EpisodeDetail> {
  const clinicId = writableClinic(scope);
  const ref = await loadReferenceData(db);
  await db
    .transaction(async (tx) => {
      await assertClinicAccepts(tx, clinicId); // a deactivated clinic accepts nothing new
      const row = await episodeInScope(tx, scope, id, true);
      if (row.version !== patch.version) {
        throw new ConflictError(
          `This episode was changed by someone else since you opened it (your version ${patch.version}, now ${row.version}); reload it to see their changes, then make yours again`,
        );
      }
      const { version: _v, ...fields } = patch;
      const next: EpisodeRow = { ...row };
      for (const f of PATCHABLE) if (fields[f] !== undefined) (next as Record<string, unknown>)[f] = fields[f];
      // Reopening clears the discharge unless the caller sets it explicitly (which the state rules then refuse).
      if (fields.status === 'open' && row.status !== 'open') {
        if (fields.dischargeDate === undefined) next.dischargeDate = null;
        if (fields.dischargeReason === undefined) next.dischargeReason = null;
      }
      const problems = episodeStateProblems(next);
      if (!ref.conditions.has(next.conditionCode)) problems.push({ field: 'conditionCode', message: `Unknown condition “${next.conditionCode}”` });
      if (next.startDate !== row.startDate) {
        const [b] = await tx
          .select({ on: assessments.assessedOn })
          .from(assessments)
          .where(and(eq(assessments.episodeId, id), eq(assessments.timepoint, 'baseline')));
        if (b && b.on < next.startDate) problems.push({ field: 'startDate', message: `The start date cannot be after the baseline assessment (${b.on})` });
      }
      throwIfProblems(problems, [], 'Some fields are not valid');
      const changes = describeChanges(row, next, PATCHABLE);
      if (Object.keys(changes).length === 0) return;
      const set: Partial<EpisodeRow> = {};
      for (const f of Object.keys(changes) as (typeof PATCHABLE)[number][]) (set as Record<string, unknown>)[f] = next[f];
      await tx
        .update(episodes)
        .set({ ...set, version: sql`${episodes.version} + 1`, updatedBy: scope.userId, updatedAt: sql`now()` })
        .where(and(eq(episodes.id, id), eq(episodes.version, patch.version)));
      await audit(tx, {
        actorId: scope.userId,
        clinicId,
        action: 'update',
        entity: 'episode',
        entityId: id,
        detail: { reference: next.reference, fromVersion: row.version, toVersion: row.version + 1, changes },
      });
    })
    .catch((err: unknown) => conflictOnDuplicate(err, `Your clinic already has an episode with the reference “${patch.reference ?? ''}”`));
  return getEpisode(db, scope, id);
}
