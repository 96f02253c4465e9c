import { sql } from 'drizzle-orm';
import type { AnalyticsFilters } from '../../../shared/schemas/analytics-filters';
import type { SubgroupKey } from '../../../shared/schemas/analytics-subgroups';
import type { Db } from '../../db/client';
import { episodeTuplesSql } from './episode-tuples-sql';

/**
 * The one SQL query behind each analytics endpoint: it reduces episodes, assessments and scores to one
 * compact tuple per episode (recovery time and event, baseline and primary follow-up, subgroup facts),
 * so only what the statistics in analysis/ need leaves the database.
 *
 * Definitions (mirroring analysis/outcomes, which the integration tests recompute from plain rows):
 * - weeks = days since the episode's start / 7, assessments before the start ignored;
 * - recovery event = first assessment after week 0 meeting the rule, else censored at the last assessment
 *   with a score on the recovery instrument (recoveryObservation);
 * - primary follow-up = the assessment nearest the target week inside the window, earlier on a tie
 *   (selectPrimaryFollowUp); the baseline is the assessment with timepoint 'baseline'.
 */

export type Cohort = {
  /** Restrict to one clinic (null = every clinic). */
  clinicId: number | null;
  consentingOnly: boolean;
  activeClinicsOnly: boolean;
  filters: AnalyticsFilters;
};

export type TupleOptions = {
  cohort: Cohort;
  /** Episodes of this clinic get `own = true` and the per-subject extras below; null = every episode is own. */
  ownClinicId: number | null;
  recovery?: { instrumentId: number; threshold: number; atLeast: boolean };
  /** Baseline of this instrument and (unless `primary` is false) its primary follow-up, for every episode. */
  responder?: { instrumentId: number; fromWeek: number; toWeek: number; targetWeek: number; primary?: boolean };
  /** Baseline and primary follow-up of these instruments, own episodes only. */
  changes?: { fromWeek: number; toWeek: number; targetWeek: number; instrumentIds: number[] };
  completeness?: { fromDay: number; toDay: number };
  addOns?: boolean;
  /** Subgroup facts to return (only what the endpoint groups or narrows by: fewer columns, faster). */
  facts?: readonly SubgroupKey[];
  /**
   * Return the subject's episodes in full and everyone's recovery observations only as counts per
   * (time, event): the registry curve needs nothing more, and 100,000 rows become a few hundred.
   */
  registryAsCounts?: boolean;
  /** Return each episode's clinic id / start quarter. */
  clinic?: boolean;
  quarter?: boolean;
};

/** One episode reduced to what the statistics need; columns not asked for are null. */
export type EpisodeTuple = {
  own: boolean;
  clinic_id: number | null;
  quarter: string | null;
  activity_profile: string | null;
  sex: string | null;
  age_years: number | null;
  height_cm: number | null;
  weight_kg: number | null;
  symptom_weeks: number | null;
  event_weeks: number | null;
  last_weeks: number | null;
  baseline: number | null;
  primary_weeks: number | null;
  primary_value: number | null;
  w12_due: boolean | null;
  w12_done: boolean | null;
  /** [instrumentId, baseline, primaryWeeks, primaryValue] per instrument (own episodes, `changes` only). */
  changes: [number, number | null, number | null, number | null][] | null;
  addons: string[] | null;
};

export { cohortCondition, episodeTuplesSql } from './episode-tuples-sql';

type RawRow = Record<string, unknown> & { own: boolean };

const num = (v: unknown): number | null => (v === null || v === undefined ? null : Number(v));

/**
 * Runs the query in a read-only transaction with JIT compilation off (on these one-off aggregates it costs
 * seconds and saves nothing) and enough work memory to sort in memory, then shapes the rows.
 */
export async function loadEpisodeTuples(db: Db, o: TupleOptions): Promise<EpisodeTuple[]> {
  return (await loadEpisodeTuplesWithCounts(db, o)).tuples;
}

/** Recovery observations of a whole cohort as counts: `n` episodes with this time and event. */
export type ObsCount = { time: number; event: boolean; n: number };

export async function loadEpisodeTuplesWithCounts(
  db: Db,
  o: TupleOptions,
): Promise<{ tuples: EpisodeTuple[]; counts: ObsCount[] }> {
  const rows = await db.transaction(
    async (tx) => {
      await tx.execute(sql`select set_config('jit', 'off', true), set_config('work_mem', '64MB', true)`);
      return (await tx.execute<RawRow>(episodeTuplesSql(o))).rows;
    },
    { accessMode: 'read only' },
  );
  const ids = o.changes?.instrumentIds ?? [];
  const counts: ObsCount[] = [];
  const detail = rows.filter((r) => {
    if (r.h_n === undefined || r.h_n === null) return true;
    counts.push({ time: Number(r.h_t), event: r.h_ev === true, n: Number(r.h_n) });
    return false;
  });
  const tuples = detail.map((r) => ({
    own: r.own,
    clinic_id: num(r.clinic_id),
    quarter: (r.quarter as string | undefined) ?? null,
    activity_profile: (r.activity_profile as string | undefined) ?? null,
    sex: (r.sex as string | undefined) ?? null,
    age_years: num(r.age_years),
    height_cm: num(r.height_cm),
    weight_kg: num(r.weight_kg),
    symptom_weeks: num(r.symptom_weeks),
    event_weeks: num(r.event_weeks),
    last_weeks: num(r.last_weeks),
    baseline: num(r.baseline),
    primary_weeks: num(r.primary_weeks),
    primary_value: num(r.primary_value),
    w12_due: (r.w12_due as boolean | undefined) ?? null,
    w12_done: (r.w12_done as boolean | undefined) ?? null,
    changes: o.changes
      ? ids.map(
          (id) =>
            [id, num(r[`b${id}`]), num(r[`p${id}_weeks`]), num(r[`p${id}_value`])] as [
              number,
              number | null,
              number | null,
              number | null,
            ],
        )
      : null,
    addons: (r.addons as string[] | undefined) ?? null,
  }));
  return { tuples, counts };
}
