import { sql } from 'drizzle-orm';
import type { Tx } from './audit';
import type { ReferenceData } from './reference.service';
import type { Plan } from './uploads-plan';

/** Rows per statement: arrays passed to unnest(), so one round trip per batch and no parameter limit. */
const BATCH = 5000;
const p = (v: unknown[]) => sql.param(v);

function* batches<T>(items: T[], size = BATCH): Generator<T[]> {
  for (let i = 0; i < items.length; i += size) yield items.slice(i, i + size);
}

export type WriteCounts = { episodesCreated: number; episodesUpdated: number; assessmentsCreated: number; assessmentsUpdated: number };

/** Writes a plan inside the caller's transaction with batched multi-row statements (no per-row round trips). */
export async function writePlan(tx: Tx, clinicId: number, userId: number | null, plan: Plan, ref: ReferenceData): Promise<WriteCounts> {
  const idOf = new Map<string, number>();
  for (const e of plan.episodes) if (e.stored) idOf.set(e.reference, e.stored.id);

  const created = plan.episodes.filter((e) => !e.stored);
  for (const b of batches(created)) {
    const col = <K extends keyof (typeof b)[number]['fields']>(k: K) => p(b.map((e) => e.fields[k]));
    const res = await tx.execute<{ id: number; reference: string }>(sql`
      insert into episode (clinic_id, created_by, updated_by, pseudonym, reference, condition_code, side, start_date, symptom_weeks,
        age_years, sex, height_cm, weight_kg, activity_profile, standing_work, research_consent, status, discharge_date, discharge_reason)
      select ${clinicId}::int, ${userId}::int, ${userId}::int, * from unnest(${col('pseudonym')}::text[], ${col('reference')}::text[],
        ${col('conditionCode')}::text[], ${col('side')}::text[], ${col('startDate')}::date[], ${col('symptomWeeks')}::int[],
        ${col('ageYears')}::int[], ${col('sex')}::text[], ${col('heightCm')}::numeric[], ${col('weightKg')}::numeric[],
        ${col('activityProfile')}::text[], ${col('standingWork')}::bool[], ${col('researchConsent')}::bool[], ${col('status')}::text[],
        ${col('dischargeDate')}::date[], ${col('dischargeReason')}::text[])
      returning id, reference`);
    for (const r of res.rows) idOf.set(r.reference, r.id);
  }

  const updated = plan.episodes.filter((e) => e.stored && e.changed.length > 0);
  for (const b of batches(updated)) {
    const col = <K extends keyof (typeof b)[number]['fields']>(k: K) => p(b.map((e) => e.fields[k]));
    await tx.execute(sql`
      update episode e set condition_code = u.condition_code, side = u.side, start_date = u.start_date, symptom_weeks = u.symptom_weeks,
        age_years = u.age_years, sex = u.sex, height_cm = u.height_cm, weight_kg = u.weight_kg, activity_profile = u.activity_profile,
        standing_work = u.standing_work, research_consent = u.research_consent, status = u.status, discharge_date = u.discharge_date,
        discharge_reason = u.discharge_reason, version = e.version + 1, updated_by = ${userId}::int, updated_at = now()
      from unnest(${p(b.map((e) => e.stored!.id))}::int[], ${col('conditionCode')}::text[], ${col('side')}::text[], ${col('startDate')}::date[],
        ${col('symptomWeeks')}::int[], ${col('ageYears')}::int[], ${col('sex')}::text[], ${col('heightCm')}::numeric[], ${col('weightKg')}::numeric[],
        ${col('activityProfile')}::text[], ${col('standingWork')}::bool[], ${col('researchConsent')}::bool[], ${col('status')}::text[],
        ${col('dischargeDate')}::date[], ${col('dischargeReason')}::text[])
        as u(id, condition_code, side, start_date, symptom_weeks, age_years, sex, height_cm, weight_kg, activity_profile, standing_work,
          research_consent, status, discharge_date, discharge_reason)
      where e.id = u.id and e.clinic_id = ${clinicId}::int`);
  }

  const withList = plan.episodes.filter((e) => e.interventions);
  const replaced = withList.filter((e) => e.stored).map((e) => e.stored!.id);
  for (const b of batches(replaced)) await tx.execute(sql`delete from episode_intervention where episode_id = any(${p(b)}::int[])`);
  const intRows = withList.flatMap((e) => e.interventions!.map((i) => ({ episodeId: idOf.get(e.reference)!, ...i })));
  for (const b of batches(intRows)) {
    await tx.execute(sql`insert into episode_intervention (episode_id, intervention_code_id, start_week, max_level)
      select * from unnest(${p(b.map((r) => r.episodeId))}::int[], ${p(b.map((r) => r.codeId))}::int[],
        ${p(b.map((r) => r.startWeek))}::int[], ${p(b.map((r) => r.maxLevel))}::int[])`);
  }

  // Scores are written right after their assessments' batch, so at most one batch of score rows is in memory.
  const writeScores = async (rows: { assessmentId: number; scores: Record<string, number | null> }[]) => {
    const a: number[] = [];
    const i: number[] = [];
    const v: number[] = [];
    for (const r of rows) {
      for (const code in r.scores) {
        const value = r.scores[code];
        if (value === null || value === undefined) continue;
        a.push(r.assessmentId);
        i.push(ref.instruments.get(code)!.id);
        v.push(value);
      }
    }
    if (a.length === 0) return;
    await tx.execute(sql`insert into score (assessment_id, instrument_id, value)
      select * from unnest(${p(a)}::int[], ${p(i)}::int[], ${p(v)}::numeric[])`);
  };
  const newAsm = plan.assessments.filter((a) => !a.stored);
  for (const b of batches(newAsm)) {
    const res = await tx.execute<{ id: number; episode_id: number; assessed_on: string; timepoint: string }>(sql`
      insert into assessment (episode_id, assessed_on, timepoint, reporter, avg_daily_steps, adverse_event, created_by)
      select *, ${userId}::int from unnest(${p(b.map((a) => a.episodeId ?? idOf.get(a.reference)))}::int[], ${p(b.map((a) => a.assessedOn))}::date[],
        ${p(b.map((a) => a.timepoint))}::text[], ${p(b.map((a) => a.reporter))}::text[], ${p(b.map((a) => a.avgDailySteps))}::int[],
        ${p(b.map((a) => a.adverseEvent))}::text[])
      returning id, episode_id, assessed_on, timepoint`);
    // Matched back by the natural key (episode, date, timepoint), which the unique index guarantees.
    const idByKey = new Map(res.rows.map((r) => [`${r.episode_id}|${r.assessed_on}|${r.timepoint}`, r.id]));
    await writeScores(b.map((a) => ({ assessmentId: idByKey.get(`${a.episodeId ?? idOf.get(a.reference)}|${a.assessedOn}|${a.timepoint}`)!, scores: a.scores })));
  }
  const changedAsm = plan.assessments.filter((a) => a.stored);
  for (const b of batches(changedAsm)) {
    const ids = b.map((a) => a.stored!.id);
    await tx.execute(sql`
      update assessment a set assessed_on = u.d, reporter = u.r, avg_daily_steps = u.s, adverse_event = u.x
      from unnest(${p(ids)}::int[], ${p(b.map((a) => a.assessedOn))}::date[], ${p(b.map((a) => a.reporter))}::text[],
        ${p(b.map((a) => a.avgDailySteps))}::int[], ${p(b.map((a) => a.adverseEvent))}::text[]) as u(id, d, r, s, x)
      where a.id = u.id`);
    await tx.execute(sql`delete from score where assessment_id = any(${p(ids)}::int[])`);
    await writeScores(b.map((a) => ({ assessmentId: a.stored!.id, scores: a.scores })));
  }
  return {
    episodesCreated: created.length,
    episodesUpdated: updated.length,
    assessmentsCreated: newAsm.length,
    assessmentsUpdated: changedAsm.length,
  };
}
