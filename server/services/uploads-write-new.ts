import { sql, type SQL } from 'drizzle-orm';
import type { ReferenceData } from './reference.service';
import type { PlannedAssessment, PlannedEpisode } from './uploads-plan';

const p = (v: unknown[]) => sql.param(v);

/** The score rows of some assessments as three parallel arrays; `key` is each assessment's position (1-based) or id. */
export function scoreArrays(list: { scores: Record<string, number | null> }[], key: (index: number) => number, ref: ReferenceData) {
  const of: number[] = [];
  const instrument: number[] = [];
  const value: number[] = [];
  list.forEach((a, k) => {
    for (const code in a.scores) {
      const v = a.scores[code];
      if (v === null || v === undefined) continue;
      of.push(key(k));
      instrument.push(ref.instruments.get(code)!.id);
      value.push(v);
    }
  });
  return { of, instrument, value };
}

/**
 * One statement for a chunk's new rows: its new episodes, their interventions, the new assessments (of new and
 * of stored episodes) and their scores. Ids come from the tables' own sequences inside the statement and rows
 * are joined by their position in the arrays, so nothing travels back and the next chunk can be checked while
 * the database works. Every foreign key is checked by PostgreSQL as for any insert (at the end of the statement).
 */
export function newRowsStatement(clinicId: number, userId: number | null, created: PlannedEpisode[], fresh: PlannedAssessment[], ref: ReferenceData): SQL | null {
  if (created.length === 0 && fresh.length === 0) return null;
  const ordOf = new Map<string, number>();
  created.forEach((e, k) => ordOf.set(e.reference, k + 1));
  const col = <K extends keyof PlannedEpisode['fields']>(k: K) => p(created.map((e) => e.fields[k]));

  const iOrd: number[] = [];
  const iCode: number[] = [];
  const iWeek: number[] = [];
  const iLevel: (number | null)[] = [];
  created.forEach((e, k) => {
    for (const i of e.interventions ?? []) {
      iOrd.push(k + 1);
      iCode.push(i.codeId);
      iWeek.push(i.startWeek);
      iLevel.push(i.maxLevel);
    }
  });
  const s = scoreArrays(fresh, (k) => k + 1, ref);
  const a = <T>(f: (x: PlannedAssessment) => T) => p(fresh.map(f));

  return sql`
    with ne as materialized (
      select nextval('episode_id_seq'::regclass)::int as id, u.*
      from unnest(${col('pseudonym')}::text[], ${col('reference')}::text[], ${col('conditionCode')}::text[], ${col('side')}::text[],
        ${col('startDate')}::date[], ${col('symptomWeeks')}::int[], ${col('ageYears')}::int[], ${col('sex')}::text[],
        ${col('heightCm')}::numeric[], ${col('weightKg')}::numeric[], ${col('activityProfile')}::text[], ${col('standingWork')}::bool[],
        ${col('researchConsent')}::bool[], ${col('status')}::text[], ${col('dischargeDate')}::date[], ${col('dischargeReason')}::text[])
        with ordinality as u(pseudonym, reference, condition_code, side, start_date, symptom_weeks, age_years, sex, height_cm, weight_kg,
          activity_profile, standing_work, research_consent, status, discharge_date, discharge_reason, ord)
    ), new_episodes as (
      insert into episode (id, clinic_id, created_by, updated_by, pseudonym, reference, condition_code, side, start_date, symptom_weeks,
        age_years, sex, height_cm, weight_kg, activity_profile, standing_work, research_consent, status, discharge_date, discharge_reason)
      select id, ${clinicId}::int, ${userId}::int, ${userId}::int, pseudonym, reference, condition_code, side, start_date, symptom_weeks,
        age_years, sex, height_cm, weight_kg, activity_profile, standing_work, research_consent, status, discharge_date, discharge_reason
      from ne
    ), new_interventions as (
      insert into episode_intervention (episode_id, intervention_code_id, start_week, max_level)
      select ne.id, x.code_id, x.start_week, x.max_level
      from unnest(${p(iOrd)}::int[], ${p(iCode)}::int[], ${p(iWeek)}::int[], ${p(iLevel)}::int[]) as x(ord, code_id, start_week, max_level)
      join ne on ne.ord = x.ord
    ), na as materialized (
      select nextval('assessment_id_seq'::regclass)::int as id, coalesce(u.episode_id, ne.id) as episode_id, u.assessed_on, u.timepoint,
        u.reporter, u.steps, u.adverse, u.ord
      from unnest(${a((x) => x.episodeId ?? null)}::int[], ${a((x) => (x.episodeId === undefined ? ordOf.get(x.reference)! : null))}::int[],
        ${a((x) => x.assessedOn)}::date[], ${a((x) => x.timepoint)}::text[], ${a((x) => x.reporter)}::text[],
        ${a((x) => x.avgDailySteps)}::int[], ${a((x) => x.adverseEvent)}::text[])
        with ordinality as u(episode_id, episode_ord, assessed_on, timepoint, reporter, steps, adverse, ord)
      left join ne on ne.ord = u.episode_ord
    ), new_assessments as (
      insert into assessment (id, episode_id, assessed_on, timepoint, reporter, avg_daily_steps, adverse_event, created_by)
      select id, episode_id, assessed_on, timepoint, reporter, steps, adverse, ${userId}::int from na
    )
    insert into score (assessment_id, instrument_id, value)
    select na.id, s.instrument_id, s.value
    from unnest(${p(s.of)}::int[], ${p(s.instrument)}::int[], ${p(s.value)}::numeric[]) as s(ord, instrument_id, value)
    join na on na.ord = s.ord`;
}
