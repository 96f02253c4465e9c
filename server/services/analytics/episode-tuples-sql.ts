import { sql, type SQL } from 'drizzle-orm';
import type { SubgroupKey } from '../../../shared/schemas/analytics-subgroups';
import type { Cohort, TupleOptions } from './episode-tuples';

/**
 * The SQL of the per-episode tuples: the cohort's episodes, left-joined to one aggregate over their
 * assessments and scores grouped by episode (FILTER aggregates for each quantity). Plain joins rather than a
 * materialised CTE, so PostgreSQL can plan (and parallelise) them freely. Episodes without any score still
 * get their row (nulls), so the statistics can count them. Only scalars leave the database (arrays are slow
 * to parse in Node).
 */

/** The cohort's conditions on an episode alias `e` (and, for active clinics only, its clinic). */
export function cohortCondition(c: Cohort, e = 'e'): SQL {
  const col = (name: string) => sql.raw(`${e}.${name}`);
  const parts: SQL[] = [sql`true`];
  if (c.clinicId !== null) parts.push(sql`${col('clinic_id')} = ${c.clinicId}`);
  if (c.consentingOnly) parts.push(sql`${col('research_consent')}`);
  if (c.activeClinicsOnly)
    parts.push(sql`exists (select 1 from clinic c where c.id = ${col('clinic_id')} and c.active)`);
  const f = c.filters;
  if (f.from) parts.push(sql`${col('start_date')} >= ${f.from}::date`);
  if (f.to) parts.push(sql`${col('start_date')} <= ${f.to}::date`);
  if (f.condition) parts.push(sql`${col('condition_code')} = ${f.condition}`);
  return sql.join(parts, sql` and `);
}

const DAYS = sql`(a.assessed_on - x.start_date)`;
const WEEKS = sql`(${DAYS}::float8 / 7)`;

/**
 * The assessment nearest the target week inside the window: min() over [distance, weeks, assessment id, value]
 * compares element by element, so the nearest wins, then the earlier, then the first entered. PostgreSQL
 * computes the identical aggregate once, however often it is subscripted.
 */
function nearest(alias: string, w: { targetWeek: number; fromWeek: number; toWeek: number }, where: SQL): SQL {
  const agg = sql`(min(array[abs(${WEEKS} - ${w.targetWeek}::float8), ${WEEKS}, a.id::float8, s.value::float8])
      filter (where ${where} and ${WEEKS} between ${w.fromWeek}::float8 and ${w.toWeek}::float8))`;
  return sql`${agg}[2] as ${sql.raw(`${alias}_weeks`)}, ${agg}[4] as ${sql.raw(`${alias}_value`)}`;
}

const FACTS: [SubgroupKey, string[]][] = [
  ['activity', ['activity_profile']],
  ['sex', ['sex']],
  ['age', ['age_years']],
  ['bmi', ['height_cm', 'weight_kg']],
  ['duration', ['symptom_weeks']],
];
const FACT_SQL: Record<string, SQL> = {
  activity_profile: sql`e.activity_profile`,
  sex: sql`e.sex`,
  age_years: sql`e.age_years`,
  height_cm: sql`e.height_cm::float8 as height_cm`,
  weight_kg: sql`e.weight_kg::float8 as weight_kg`,
  symptom_weeks: sql`e.symptom_weeks`,
};

export function episodeTuplesSql(o: TupleOptions): SQL {
  const ownOf = (alias: string) =>
    o.ownClinicId === null ? sql`true` : sql`${sql.raw(alias)}.clinic_id = ${o.ownClinicId}`;
  const rec = o.recovery;
  const resp = o.responder;
  const ch = o.changes;
  const cp = o.completeness;
  const facts = new Set(o.facts ?? []);
  const outer: SQL[] = [sql`${ownOf('e')} as own`];
  if (o.clinic) outer.push(sql`e.clinic_id`);
  if (o.quarter) outer.push(sql`to_char(e.start_date, 'YYYY-"Q"Q') as quarter`);
  for (const [key, names] of FACTS) if (facts.has(key)) for (const n of names) outer.push(FACT_SQL[n]!);
  const inner: SQL[] = [sql`a.episode_id`];
  if (rec) {
    const isRec = sql`s.instrument_id = ${rec.instrumentId}::int`;
    const meets = rec.atLeast ? sql`s.value >= ${rec.threshold}` : sql`s.value <= ${rec.threshold}`;
    inner.push(sql`min(${WEEKS}) filter (where ${isRec} and ${WEEKS} > 0 and ${meets}) as event_weeks`);
    inner.push(sql`max(${WEEKS}) filter (where ${isRec}) as last_weeks`);
  }
  if (resp) {
    const isResp = sql`s.instrument_id = ${resp.instrumentId}::int`;
    inner.push(sql`min(s.value::float8) filter (where ${isResp} and a.timepoint = 'baseline') as baseline`);
    if (resp.primary !== false) inner.push(nearest('primary', resp, isResp));
  }
  // The subject's own episodes: baseline and primary follow-up of every instrument, and week-12 completeness.
  for (const id of ch?.instrumentIds ?? []) {
    const isI = sql`x.own and s.instrument_id = ${id}::int`;
    inner.push(sql`min(s.value::float8) filter (where ${isI} and a.timepoint = 'baseline') as ${sql.raw(`b${id}`)}`);
    inner.push(nearest(`p${id}`, ch!, isI));
  }
  if (cp) {
    inner.push(
      sql`bool_or(x.own and a.timepoint <> 'baseline' and ${DAYS} between ${cp.fromDay}::int and ${cp.toDay}::int) as w12_any`,
    );
    outer.push(sql`case when ${ownOf('e')} then e.start_date + ${cp.toDay}::int < current_date end as w12_due`);
    outer.push(sql`case when ${ownOf('e')} then coalesce(g.w12_any, false) end as w12_done`);
  }
  outer.push(sql`g.*`);
  const ids = [rec?.instrumentId, resp?.instrumentId].filter((v): v is number => v !== undefined);
  const wanted = sql.join([...ids.map((i) => sql`${i}::int`), sql`null`], sql`, `);
  // Scores of the instruments asked for; the subject's episodes bring every instrument when changes are asked for.
  const scoreFilter = ch || cp ? sql`(s.instrument_id in (${wanted}) or x.own)` : sql`s.instrument_id in (${wanted})`;
  if (o.addOns) outer.push(sql`ad.addons`);
  const addOns = o.addOns
    ? sql`left join (
        select ei.episode_id, array_agg(ic.code order by ic.code) as addons
        from episode_intervention ei join intervention_code ic on ic.id = ei.intervention_code_id and ic.kind = 'addon'
        group by ei.episode_id) ad on ad.episode_id = e.id`
    : sql``;
  const tuples = sql`
    select ${sql.join(outer, sql`, `)}
    from episode e
    left join (
      select ${sql.join(inner, sql`, `)}
      from (select x0.id, x0.start_date, ${ownOf('x0')} as own from episode x0 where ${cohortCondition(o.cohort, 'x0')}) x
      join assessment a on a.episode_id = x.id and a.assessed_on >= x.start_date
      left join score s on s.assessment_id = a.id and ${scoreFilter}
      group by a.episode_id
    ) g on g.episode_id = e.id
    ${addOns}
    where ${cohortCondition(o.cohort, 'e')}`;
  if (!o.registryAsCounts) return tuples;
  // The subject's rows in full, then one row per (time, event) of the whole cohort with its count; the
  // `left join ... on false` gives those rows the same (null) tuple columns, so UNION ALL lines up.
  return sql`
    with q as materialized (${tuples}),
    h as (
      select coalesce(event_weeks, last_weeks) as t, event_weeks is not null as ev, count(*)::int as n
      from q where coalesce(event_weeks, last_weeks) is not null group by 1, 2
    )
    select q.*, null::float8 as h_t, null::boolean as h_ev, null::int as h_n from q where q.own
    union all
    select q.*, h.t, h.ev, h.n from h left join q on false`;
}
