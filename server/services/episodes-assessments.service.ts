import { and, eq } from 'drizzle-orm';
import type { AssessmentInput, EpisodeDetail, InterventionsPut } from '../../shared/schemas/episode';
import type { Db } from '../db/client';
import type { Scope } from '../db/scope';
import { assessments, episodeInterventions, interventionCodes } from '../db/schema';
import { ConflictError, ValidationError } from '../errors';
import { audit } from './audit';
import { assertClinicAccepts } from './clinics.service';
import { assessmentDateProblem } from './episodes-rules';
import { episodeInScope, writableClinic } from './episodes-scope';
import { getEpisode } from './episodes.service';
import { conflictOnDuplicate, insertScores, throwIfProblems } from './episodes-write.service';
import { resolveInterventions, scoreProblems } from './reference-checks';
import { loadReferenceData } from './reference.service';

/** Records one assessment: one baseline per episode, follow-ups never before it, scores inside their ranges. */
export async function addAssessment(db: Db, scope: Scope, id: number, input: AssessmentInput): Promise<EpisodeDetail> {
  const clinicId = writableClinic(scope);
  const ref = await loadReferenceData(db);
  throwIfProblems(scoreProblems(input.scores, ref), ['scores'], 'Some scores are not valid');
  await db
    .transaction(async (tx) => {
      await assertClinicAccepts(tx, clinicId); // a deactivated clinic accepts nothing new
      // Locking the episode row serialises assessments of one episode (no two baselines by a race).
      const e = await episodeInScope(tx, scope, id, true);
      const [baseline] = await tx
        .select({ on: assessments.assessedOn })
        .from(assessments)
        .where(and(eq(assessments.episodeId, id), eq(assessments.timepoint, 'baseline')));
      if (input.timepoint === 'baseline' && baseline) {
        throw new ConflictError(`This episode already has its baseline (${baseline.on}); an episode has exactly one`);
      }
      const problem = assessmentDateProblem(input.timepoint, input.assessedOn, e.startDate, baseline?.on ?? null);
      if (problem) throw new ValidationError(problem, [{ path: ['assessedOn'], message: problem, code: 'custom' }]);
      const [a] = await tx
        .insert(assessments)
        .values({
          episodeId: id,
          assessedOn: input.assessedOn,
          timepoint: input.timepoint,
          reporter: input.reporter,
          avgDailySteps: input.avgDailySteps ?? null,
          adverseEvent: input.adverseEvent || null,
          createdBy: scope.userId,
        })
        .returning({ id: assessments.id });
      await insertScores(tx, a!.id, input.scores, ref);
      await audit(tx, {
        actorId: scope.userId,
        clinicId,
        action: 'create',
        entity: 'assessment',
        entityId: a!.id,
        detail: { episodeId: id, reference: e.reference, timepoint: input.timepoint, assessedOn: input.assessedOn, instruments: Object.keys(input.scores) },
      });
    })
    .catch((err: unknown) =>
      conflictOnDuplicate(err, `This episode already has a ${input.timepoint} assessment on ${input.assessedOn}`),
    );
  return getEpisode(db, scope, id);
}

const key = (r: { code: string; startWeek: number; maxLevel: number | null }) => `${r.code}@${r.startWeek}:${r.maxLevel ?? ''}`;

/** Replaces the episode's interventions with the given list (levels only on graded codes). */
export async function setInterventions(db: Db, scope: Scope, id: number, input: InterventionsPut): Promise<EpisodeDetail> {
  const clinicId = writableClinic(scope);
  const ref = await loadReferenceData(db);
  const { resolved, problems } = resolveInterventions(input.interventions, ref);
  throwIfProblems(problems, ['interventions'], 'Some interventions are not valid');
  await db.transaction(async (tx) => {
    await assertClinicAccepts(tx, clinicId); // a deactivated clinic accepts nothing new
    const e = await episodeInScope(tx, scope, id, true);
    const before = await tx
      .select({ code: interventionCodes.code, startWeek: episodeInterventions.startWeek, maxLevel: episodeInterventions.maxLevel })
      .from(episodeInterventions)
      .innerJoin(interventionCodes, eq(interventionCodes.id, episodeInterventions.interventionCodeId))
      .where(eq(episodeInterventions.episodeId, id));
    const was = new Map(before.map((b) => [b.code, b]));
    const now = new Map(resolved.map((r) => [r.code, r]));
    const added = resolved.filter((r) => !was.has(r.code)).map((r) => r.code);
    const removed = before.filter((b) => !now.has(b.code)).map((b) => b.code);
    const changed = resolved.filter((r) => was.has(r.code) && key(was.get(r.code)!) !== key(r)).map((r) => r.code);
    if (added.length + removed.length + changed.length === 0) return;
    await tx.delete(episodeInterventions).where(eq(episodeInterventions.episodeId, id));
    if (resolved.length > 0) {
      await tx.insert(episodeInterventions).values(
        resolved.map((r) => ({ episodeId: id, interventionCodeId: r.codeId, startWeek: r.startWeek, maxLevel: r.maxLevel })),
      );
    }
    await audit(tx, {
      actorId: scope.userId,
      clinicId,
      action: 'update',
      entity: 'episode-interventions',
      entityId: id,
      detail: { reference: e.reference, added, removed, changed },
    });
  });
  return getEpisode(db, scope, id);
}
