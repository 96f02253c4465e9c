import { sql } from 'drizzle-orm';
import type pg from 'pg';
import type { Tx } from './audit';
import type { ReferenceData } from './reference.service';
import type { Plan } from './uploads-plan';
import { IdPool } from './uploads-ids';
import { copyNewRows, newRowsText, scoreArrays } from './uploads-write-new';

const p = (v: unknown[]) => sql.param(v);

export type WriteCounts = { episodesCreated: number; episodesUpdated: number; assessmentsCreated: number; assessmentsUpdated: number };
export type PreparedWrite = { counts: WriteCounts; run(tx: Tx, client: pg.PoolClient): Promise<void> };

/**
 * One chunk's plan, made ready to write inside the caller's transaction (`tx` and `client` are the same
 * connection): the COPY text for everything new is made now (ids from `ids`), so `run` only sends; changes to
 * stored rows are one statement per kind (arrays through unnest(), so no per-row round trips and no parameter
 * limit). Statements run one after the other: a connection takes one query at a time.
 */
export function prepareWrite(clinicId: number, userId: number | null, plan: Plan, ref: ReferenceData, ids: IdPool): PreparedWrite {
  const created = plan.episodes.filter((e) => !e.stored);
  const fresh = plan.assessments.filter((a) => !a.stored);
  const rows = newRowsText(clinicId, userId, created, fresh, ref, ids);
  const updated = plan.episodes.filter((e) => e.stored && e.changed.length > 0);
  const counts = { episodesCreated: created.length, episodesUpdated: updated.length, assessmentsCreated: fresh.length, assessmentsUpdated: plan.assessments.length - fresh.length };
  // Only the text is kept for a plan that changes nothing stored (the usual new file): the plan's many small
  // objects are then garbage at once instead of living on, while the next chunk is read, into the old generation.
  const changes = plan.episodes.some((e) => e.stored) || counts.assessmentsUpdated > 0 ? plan : null;
  return {
    counts,
    run: async (tx, client) => {
      await copyNewRows(client, rows);
      if (changes) await writeChanges(tx, clinicId, userId, changes, ref);
    },
  };
}

/** Reserves ids for a plan and writes it (for a caller that writes one plan at a time, as the demo seed does). */
export async function writePlan(tx: Tx, client: pg.PoolClient, clinicId: number, userId: number | null, plan: Plan, ref: ReferenceData): Promise<WriteCounts> {
  const ids = new IdPool();
  await ids.ensure(tx, plan.episodes.length, plan.assessments.length);
  const prepared = prepareWrite(clinicId, userId, plan, ref, ids);
  await prepared.run(tx, client);
  return prepared.counts;
}

/** The changes to stored episodes and assessments. */
async function writeChanges(tx: Tx, clinicId: number, userId: number | null, plan: Plan, ref: ReferenceData): Promise<void> {
  const updated = plan.episodes.filter((e) => e.stored && e.changed.length > 0);
  if (updated.length > 0) {
    const col = <K extends keyof (typeof updated)[number]['fields']>(k: K) => p(updated.map((e) => e.fields[k]));
    await tx.execute(sql`
      update episode e set condition_code = u.condition_code, side = u.side, start_date = u.start_date, symptom_weeks = u.symptom_weeks,
        age_years = u.age_years, sex = u.sex, height_cm = u.height_cm, weight_kg = u.weight_kg, activity_profile = u.activity_profile,
        standing_work = u.standing_work, research_consent = u.research_consent, status = u.status, discharge_date = u.discharge_date,
        discharge_reason = u.discharge_reason, version = e.version + 1, updated_by = ${userId}::int, updated_at = now()
      from unnest(${p(updated.map((e) => e.stored!.id))}::int[], ${col('conditionCode')}::text[], ${col('side')}::text[], ${col('startDate')}::date[],
        ${col('symptomWeeks')}::int[], ${col('ageYears')}::int[], ${col('sex')}::text[], ${col('heightCm')}::numeric[], ${col('weightKg')}::numeric[],
        ${col('activityProfile')}::text[], ${col('standingWork')}::bool[], ${col('researchConsent')}::bool[], ${col('status')}::text[],
        ${col('dischargeDate')}::date[], ${col('dischargeReason')}::text[])
        as u(id, condition_code, side, start_date, symptom_weeks, age_years, sex, height_cm, weight_kg, activity_profile, standing_work,
          research_consent, status, discharge_date, discharge_reason)
      where e.id = u.id and e.clinic_id = ${clinicId}::int`);
  }

  // A stored episode whose list differs gets the file's list in full.
  const relisted = plan.episodes.filter((e) => e.stored && e.interventions);
  if (relisted.length > 0) {
    const rows = relisted.flatMap((e) => e.interventions!.map((i) => ({ episodeId: e.stored!.id, ...i })));
    // Two statements: a data-modifying WITH runs after its main query, so one statement could not clear before it inserts.
    await tx.execute(sql`delete from episode_intervention where episode_id = any(${p(relisted.map((e) => e.stored!.id))}::int[])`);
    await tx.execute(sql`
      insert into episode_intervention (episode_id, intervention_code_id, start_week, max_level)
      select * from unnest(${p(rows.map((r) => r.episodeId))}::int[], ${p(rows.map((r) => r.codeId))}::int[],
        ${p(rows.map((r) => r.startWeek))}::int[], ${p(rows.map((r) => r.maxLevel))}::int[])`);
  }

  const changed = plan.assessments.filter((a) => a.stored);
  if (changed.length > 0) {
    const ids = changed.map((a) => a.stored!.id);
    await tx.execute(sql`
      update assessment a set assessed_on = u.d, reporter = u.r, avg_daily_steps = u.s, adverse_event = u.x
      from unnest(${p(ids)}::int[], ${p(changed.map((a) => a.assessedOn))}::date[], ${p(changed.map((a) => a.reporter))}::text[],
        ${p(changed.map((a) => a.avgDailySteps))}::int[], ${p(changed.map((a) => a.adverseEvent))}::text[]) as u(id, d, r, s, x)
      where a.id = u.id`);
    // The changed assessments' scores are replaced by the merged set (the file's score columns over the stored ones).
    const s = scoreArrays(changed, (k) => ids[k]!, ref);
    await tx.execute(sql`delete from score where assessment_id = any(${p(ids)}::int[])`);
    await tx.execute(sql`
      insert into score (assessment_id, instrument_id, value)
      select * from unnest(${p(s.of)}::int[], ${p(s.instrument)}::int[], ${p(s.value)}::numeric[])`);
  }
}
