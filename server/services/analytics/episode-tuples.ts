import { sql, type SQL } from 'drizzle-orm';
import type { AnalyticsFilters } from '../../../shared/schemas/analytics-filters';
import type { SubgroupKey } from '../../../shared/schemas/analytics-subgroups';
import type { Db } from '../../db/client';

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
  responder?: { instrumentId: number; fromWeek: number; toWeek: number; targetWeek: number };
  /** Baseline and primary follow-up of these instruments, own episodes only. */
  changes?: { fromWeek: number; toWeek: number; targetWeek: number; instrumentIds: number[] };
  completeness?: { fromDay: number; toDay: number };
  addOns?: boolean;
  /** Subgroup facts to return (only what the endpoint groups or narrows by: fewer columns, faster). */
  facts?: readonly SubgroupKey[];
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

export function cohortCondition(c: Cohort): SQL {
  const parts: SQL[] = [sql`true`];
  if (c.clinicId !== null) parts.push(sql`e.clinic_id = ${c.clinicId}`);
  if (c.consentingOnly) parts.push(sql`e.research_consent`);
  if (c.activeClinicsOnly) parts.push(sql`c.active`);
  const f = c.filters;
  if (f.from) parts.push(sql`e.start_date >= ${f.from}::date`);
  if (f.to) parts.push(sql`e.start_date <= ${f.to}::date`);
  if (f.condition) parts.push(sql`e.condition_code = ${f.condition}`);
  return sql.join(parts, sql` and `);
}

const WEEKS = sql`((a.assessed_on - ep.start_date)::float8 / 7)`;
const DAYS = sql`(a.assessed_on - ep.start_date)`;

/**
 * The assessment nearest the target inside the window as [distance, weeks, assessment id, value]: min() over
 * arrays compares them element by element, so the nearest wins, then the earlier, then the first entered.
 * A plain aggregate (no ORDER BY inside), so PostgreSQL can hash it.
 */
const nearest = (w: { targetWeek: number; fromWeek: number; toWeek: number }, where: SQL) =>
  sql`min(array[abs(${WEEKS} - ${w.targetWeek}::float8), ${WEEKS}, a.id::float8, s.value::float8])
        filter (where ${where} and ${WEEKS} between ${w.fromWeek}::float8 and ${w.toWeek}::float8)`;

const FACT_COLUMNS: [SubgroupKey, SQL][] = [
  ['activity', sql`e.activity_profile`],
  ['sex', sql`e.sex`],
  ['age', sql`e.age_years`],
  ['bmi', sql`e.height_cm::float8 as height_cm, e.weight_kg::float8 as weight_kg`],
  ['duration', sql`e.symptom_weeks`],
];

const list = (ids: number[]) =>
  ids.length
    ? sql.join(
        ids.map((i) => sql`${i}::int`),
        sql`, `,
      )
    : sql`null`;
const FROM_SCORES = sql`from ep join assessment a on a.episode_id = ep.id and a.assessed_on >= ep.start_date
      join score s on s.assessment_id = a.id`;

export function episodeTuplesSql(o: TupleOptions): SQL {
  const own = o.ownClinicId === null ? sql`true` : sql`e.clinic_id = ${o.ownClinicId}`;
  const rec = o.recovery;
  const resp = o.responder;
  const ids = [rec?.instrumentId, resp?.instrumentId].filter((x): x is number => x !== undefined);
  const facts = new Set(o.facts ?? []);
  const epCols: SQL[] = [sql`e.id`, sql`e.start_date`, sql`${own} as own`];
  if (o.clinic) epCols.push(sql`e.clinic_id`);
  if (o.quarter) epCols.push(sql`to_char(e.start_date, 'YYYY-"Q"Q') as quarter`);
  for (const [key, col] of FACT_COLUMNS) if (facts.has(key)) epCols.push(col);
  // ep.id and ep.start_date are only for the joins; everything else is what the statistics need.
  const cols: SQL[] = [sql`ep.own`];
  if (o.clinic) cols.push(sql`ep.clinic_id`);
  if (o.quarter) cols.push(sql`ep.quarter`);
  if (facts.has('activity')) cols.push(sql`ep.activity_profile`);
  if (facts.has('sex')) cols.push(sql`ep.sex`);
  if (facts.has('age')) cols.push(sql`ep.age_years`);
  if (facts.has('bmi')) cols.push(sql`ep.height_cm`, sql`ep.weight_kg`);
  if (facts.has('duration')) cols.push(sql`ep.symptom_weeks`);
  const agg: SQL[] = [sql`a.episode_id`];
  if (rec) {
    const isRec = sql`s.instrument_id = ${rec.instrumentId}::int`;
    const meets = rec.atLeast ? sql`s.value >= ${rec.threshold}` : sql`s.value <= ${rec.threshold}`;
    agg.push(sql`min(${WEEKS}) filter (where ${isRec} and ${WEEKS} > 0 and ${meets}) as event_weeks`);
    agg.push(sql`max(${WEEKS}) filter (where ${isRec}) as last_weeks`);
    cols.push(sql`agg.event_weeks`, sql`agg.last_weeks`);
  }
  if (resp) {
    const isResp = sql`s.instrument_id = ${resp.instrumentId}::int`;
    agg.push(sql`min(s.value::float8) filter (where ${isResp} and a.timepoint = 'baseline') as baseline`);
    agg.push(sql`${nearest(resp, isResp)} as prim`);
    cols.push(sql`agg.baseline`, sql`agg.prim`);
  }
  // The subject's own episodes: baseline and primary follow-up of every instrument, and week-12 completeness.
  const ch = o.changes;
  const cp = o.completeness;
  const mine: SQL[] = [sql`a.episode_id`];
  for (const id of ch?.instrumentIds ?? []) {
    const isI = sql`s.instrument_id = ${id}::int`;
    mine.push(sql`min(s.value::float8) filter (where ${isI} and a.timepoint = 'baseline') as ${sql.raw(`b${id}`)}`);
    mine.push(sql`${nearest(ch!, isI)} as ${sql.raw(`p${id}`)}`);
    cols.push(sql.raw(`mine.b${id}, mine.p${id}`));
  }
  if (cp) {
    mine.push(
      sql`bool_or(a.timepoint <> 'baseline' and ${DAYS} between ${cp.fromDay}::int and ${cp.toDay}::int) as w12_done`,
    );
    cols.push(sql`case when ep.own then ep.start_date + ${cp.toDay}::int < current_date end as w12_due`);
    cols.push(sql`case when ep.own then coalesce(mine.w12_done, false) end as w12_done`);
  }
  const joins: SQL[] = [];
  const ctes: SQL[] = [];
  if (ids.length) {
    ctes.push(
      sql`agg as (select ${sql.join(agg, sql`, `)} ${FROM_SCORES} where s.instrument_id in (${list(ids)}) group by a.episode_id)`,
    );
    joins.push(sql`left join agg on agg.episode_id = ep.id`);
  }
  if (mine.length > 1) {
    ctes.push(sql`mine as (select ${sql.join(mine, sql`, `)} ${FROM_SCORES} where ep.own group by a.episode_id)`);
    joins.push(sql`left join mine on mine.episode_id = ep.id`);
  }
  if (o.addOns) {
    ctes.push(sql`ad as (
        select ei.episode_id, array_agg(ic.code order by ic.code) as addons
        from ep join episode_intervention ei on ei.episode_id = ep.id
        join intervention_code ic on ic.id = ei.intervention_code_id and ic.kind = 'addon'
        group by ei.episode_id)`);
    joins.push(sql`left join ad on ad.episode_id = ep.id`);
    cols.push(sql`ad.addons`);
  }
  return sql`
    with ep as materialized (
      select ${sql.join(epCols, sql`, `)}
      from episode e join clinic c on c.id = e.clinic_id
      where ${cohortCondition(o.cohort)}
    )${ctes.length ? sql`, ${sql.join(ctes, sql`, `)}` : sql``}
    select ${sql.join(cols, sql`, `)}
    from ep ${sql.join(joins, sql` `)}`;
}

type RawRow = Omit<EpisodeTuple, 'primary_weeks' | 'primary_value' | 'changes'> & { prim?: number[] | null } & Record<
    string,
    unknown
  >;

/** [distance, weeks, assessment id, value] → weeks and value. */
const pair = (p: unknown): [number | null, number | null] =>
  Array.isArray(p) ? [Number(p[1]), Number(p[3])] : [null, null];

/**
 * Runs the query in a read-only transaction with JIT compilation off (on these one-off aggregates it costs
 * seconds and saves nothing) and enough work memory to sort in memory, then shapes the rows.
 */
export async function loadEpisodeTuples(db: Db, o: TupleOptions): Promise<EpisodeTuple[]> {
  const rows = await db.transaction(
    async (tx) => {
      await tx.execute(sql`select set_config('jit', 'off', true), set_config('work_mem', '64MB', true)`);
      return (await tx.execute<RawRow>(episodeTuplesSql(o))).rows;
    },
    { accessMode: 'read only' },
  );
  const ids = o.changes?.instrumentIds ?? [];
  return rows.map((r) => {
    const [primary_weeks, primary_value] = pair(r.prim);
    return {
      own: r.own,
      clinic_id: r.clinic_id ?? null,
      quarter: r.quarter ?? null,
      activity_profile: r.activity_profile ?? null,
      sex: r.sex ?? null,
      age_years: r.age_years ?? null,
      height_cm: r.height_cm ?? null,
      weight_kg: r.weight_kg ?? null,
      symptom_weeks: r.symptom_weeks ?? null,
      event_weeks: r.event_weeks ?? null,
      last_weeks: r.last_weeks ?? null,
      baseline: r.baseline ?? null,
      primary_weeks,
      primary_value,
      w12_due: r.w12_due ?? null,
      w12_done: r.w12_done ?? null,
      changes: o.changes ? ids.map((id) => [id, (r[`b${id}`] as number | null) ?? null, ...pair(r[`p${id}`])]) : null,
      addons: r.addons ?? null,
    };
  });
}
