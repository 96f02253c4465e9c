import { sql } from 'drizzle-orm';
import type { Timepoint } from '../../shared/constants';
import type { Tx } from './audit';
import type { UploadEpisodeFields } from './uploads-validate';

export type StoredAssessment = {
  id: number;
  assessedOn: string;
  timepoint: Timepoint;
  reporter: 'clinician' | 'patient';
  avgDailySteps: number | null;
  adverseEvent: string | null;
  scores: Record<string, number>;
};
export type StoredIntervention = { code: string; startWeek: number; maxLevel: number | null };
export type StoredEpisode = UploadEpisodeFields & {
  id: number;
  version: number;
  assessments: StoredAssessment[];
  interventions: StoredIntervention[];
};

/** The clinic's stored episodes with these references, with assessments, scores and interventions (4 queries). */
export async function loadStoredEpisodes(tx: Tx, clinicId: number, references: string[]): Promise<Map<string, StoredEpisode>> {
  const out = new Map<string, StoredEpisode>();
  if (references.length === 0) return out;
  const eps = await tx.execute<Record<string, unknown> & { id: number; reference: string }>(sql`
    select id, version, pseudonym, reference, condition_code as "conditionCode", side, start_date as "startDate",
      symptom_weeks as "symptomWeeks", age_years as "ageYears", sex, height_cm as "heightCm", weight_kg as "weightKg",
      activity_profile as "activityProfile", standing_work as "standingWork", research_consent as "researchConsent",
      status, discharge_date as "dischargeDate", discharge_reason as "dischargeReason"
    from episode where clinic_id = ${clinicId} and reference = any(${sql.param(references)}::text[])`);
  if (eps.rows.length === 0) return out;
  const byId = new Map<number, StoredEpisode>();
  for (const r of eps.rows) {
    const e = { ...r, assessments: [], interventions: [] } as unknown as StoredEpisode;
    out.set(e.reference, e);
    byId.set(e.id, e);
  }
  const ids = sql.param([...byId.keys()]);
  // Scores come aggregated per assessment (one row each, not one per score): fewer objects in memory.
  // One query after the other: a transaction is one connection, and pg queues (and soon refuses) concurrent ones.
  // The chunk's assessments first (materialized), then a lateral lookup of each one's scores: a plain join
  // lets the planner, when the tables have no statistics yet (just after a large upload), aggregate the
  // scores of every assessment in the registry for every chunk.
  const asm = await tx.execute<{
    id: number; episode_id: number; assessed_on: string; timepoint: Timepoint; reporter: 'clinician' | 'patient';
    avg_daily_steps: number | null; adverse_event: string | null; codes: string[] | null; vals: number[] | null;
  }>(sql`
    with a as materialized (
      select id, episode_id, assessed_on, timepoint, reporter, avg_daily_steps, adverse_event from assessment
      where episode_id = any(${ids}::int[])
    )
    select a.*, sc.codes, sc.vals from a cross join lateral (
      select array_agg(i.code order by i.id) as codes, array_agg(s.value::float8 order by i.id) as vals
      from score s join instrument i on i.id = s.instrument_id where s.assessment_id = a.id
    ) sc`);
  for (const a of asm.rows) {
    const scores: Record<string, number> = {};
    a.codes?.forEach((c, k) => (scores[c] = a.vals![k]!));
    byId.get(a.episode_id)!.assessments.push({
      id: a.id,
      assessedOn: a.assessed_on,
      timepoint: a.timepoint,
      reporter: a.reporter,
      avgDailySteps: a.avg_daily_steps,
      adverseEvent: a.adverse_event,
      scores,
    });
  }
  const ints = await tx.execute<{ episode_id: number; code: string; start_week: number; max_level: number | null }>(sql`
    select ei.episode_id, c.code, ei.start_week, ei.max_level from episode_intervention ei
    join intervention_code c on c.id = ei.intervention_code_id where ei.episode_id = any(${ids}::int[])`);
  for (const i of ints.rows) byId.get(i.episode_id)!.interventions.push({ code: i.code, startWeek: i.start_week, maxLevel: i.max_level });
  return out;
}
