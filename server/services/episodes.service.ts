import { and, asc, eq, sql, type SQL } from 'drizzle-orm';
import { bmi } from '../../analysis/outcomes/bmi';
import { bmiBand } from '../../analysis/bmi-band';
import type { EpisodeDetail, EpisodeListItem, EpisodeListQuery } from '../../shared/schemas/episode';
import type { Scope } from '../db/scope';
import { assessments, episodeInterventions, episodes, instruments, interventionCodes, scores } from '../db/schema';
import type { Tx } from './audit';
import { episodeInScope, episodeScopeCondition } from './episodes-scope';

// Dates are calendar dates in UTC, like shared/follow-up-schedule.ts.
const TODAY = sql`(now() at time zone 'utc')::date`;
const LAST_ASSESSED = sql`(select max(a.assessed_on) from ${assessments} a where a.episode_id = ${episodes.id})`;
/** Open episodes count to today; closed ones to their discharge date, else their last assessment. */
const WEEKS_IN_CARE = sql<number>`coalesce(floor((coalesce(${episodes.dischargeDate}, case when ${episodes.status} = 'open' then ${TODAY} end, ${LAST_ASSESSED}, ${episodes.startDate}) - ${episodes.startDate}) / 7.0), 0)::int`;

const SORTS: Record<EpisodeListQuery['sort'], SQL> = {
  startDate: sql`${episodes.startDate}`,
  reference: sql`${episodes.reference}`,
  status: sql`${episodes.status}`,
  weeksInCare: WEEKS_IN_CARE,
};

/** One page of episodes in the caller's scope, with each one's latest first-step pain and its change so far. */
export async function listEpisodes(db: Tx, scope: Scope, q: EpisodeListQuery): Promise<{ items: EpisodeListItem[]; total: number }> {
  const where = and(
    episodeScopeCondition(scope, q.clinicId),
    q.status ? eq(episodes.status, q.status) : undefined,
    q.q ? sql`${episodes.reference} ilike ${`%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`}` : undefined,
  );
  const dir = q.order === 'asc' ? sql`asc` : sql`desc`;
  const page = db
    .select({ id: episodes.id, weeksInCare: WEEKS_IN_CARE.as('weeks_in_care'), total: sql<number>`count(*) over ()`.as('total') })
    .from(episodes)
    .where(where)
    .orderBy(sql`${SORTS[q.sort]} ${dir}`, sql`${episodes.id} ${dir}`)
    .limit(q.limit)
    .offset(q.offset)
    .as('page');
  const firstStep = sql`(select id from ${instruments} where code = 'nprs-first-step')`;
  const rows = await db.execute<{
    id: number; clinic_id: number; reference: string; start_date: string; status: EpisodeListItem['status'];
    activity_profile: EpisodeListItem['activityProfile']; version: number; weeks_in_care: number; total: number;
    last_assessed_on: string | null; latest_value: number | null; latest_is_baseline: boolean | null; baseline_value: number | null;
  }>(sql`
    select e.id, e.clinic_id, e.reference, e.start_date, e.status, e.activity_profile, e.version, page.weeks_in_care, page.total,
      (select max(a.assessed_on) from assessment a where a.episode_id = e.id) as last_assessed_on,
      lp.value as latest_value, lp.is_baseline as latest_is_baseline, bp.value as baseline_value
    from ${page} join episode e on e.id = page.id
    left join lateral (
      select s.value, a.timepoint = 'baseline' as is_baseline from assessment a join score s on s.assessment_id = a.id
      where a.episode_id = e.id and s.instrument_id = ${firstStep}
      order by a.assessed_on desc, (a.timepoint = 'baseline') asc, a.id desc limit 1) lp on true
    left join lateral (
      select s.value from assessment a join score s on s.assessment_id = a.id
      where a.episode_id = e.id and a.timepoint = 'baseline' and s.instrument_id = ${firstStep}) bp on true
    order by ${sql.raw(q.sort === 'weeksInCare' ? 'page.weeks_in_care' : q.sort === 'startDate' ? 'e.start_date' : `e.${q.sort}`)} ${dir}, e.id ${dir}`);
  const items = rows.rows.map((r) => ({
    id: r.id,
    clinicId: r.clinic_id,
    reference: r.reference,
    startDate: r.start_date,
    status: r.status,
    weeksInCare: r.weeks_in_care,
    activityProfile: r.activity_profile,
    lastAssessedOn: r.last_assessed_on,
    latestFirstStepPain: r.latest_value,
    firstStepPainChange: r.latest_value !== null && r.baseline_value !== null && !r.latest_is_baseline ? r.latest_value - r.baseline_value : null,
    version: r.version,
  }));
  let total = rows.rows[0]?.total;
  if (total === undefined) {
    const [c] = await db.select({ n: sql<number>`count(*)::int` }).from(episodes).where(where);
    total = c?.n ?? 0;
  }
  return { items, total };
}

/** One episode with its assessments (and their scores), interventions, and BMI with its WHO band. */
export async function getEpisode(db: Tx, scope: Scope, id: number): Promise<EpisodeDetail> {
  const e = await episodeInScope(db, scope, id);
  const [rows, ints] = await Promise.all([
    db
      .select({ a: assessments, code: instruments.code, value: scores.value })
      .from(assessments)
      .leftJoin(scores, eq(scores.assessmentId, assessments.id))
      .leftJoin(instruments, eq(instruments.id, scores.instrumentId))
      .where(eq(assessments.episodeId, id))
      .orderBy(asc(assessments.assessedOn), sql`${assessments.timepoint} <> 'baseline'`, asc(assessments.id)),
    db
      .select({ i: episodeInterventions, code: interventionCodes })
      .from(episodeInterventions)
      .innerJoin(interventionCodes, eq(interventionCodes.id, episodeInterventions.interventionCodeId))
      .where(eq(episodeInterventions.episodeId, id))
      .orderBy(sql`${interventionCodes.kind} = 'core' desc`, asc(interventionCodes.id)),
  ]);
  const byId = new Map<number, EpisodeDetail['assessments'][number]>();
  const startDay = Date.parse(`${e.startDate}T00:00:00Z`);
  for (const r of rows) {
    let a = byId.get(r.a.id);
    if (!a) {
      a = {
        id: r.a.id,
        assessedOn: r.a.assessedOn,
        timepoint: r.a.timepoint,
        reporter: r.a.reporter,
        daysSinceStart: Math.round((Date.parse(`${r.a.assessedOn}T00:00:00Z`) - startDay) / 86_400_000),
        avgDailySteps: r.a.avgDailySteps,
        adverseEvent: r.a.adverseEvent,
        scores: {},
      };
      byId.set(r.a.id, a);
    }
    if (r.code !== null && r.value !== null) a.scores[r.code] = r.value;
  }
  const value = bmi(e.heightCm, e.weightKg);
  return {
    id: e.id,
    clinicId: e.clinicId,
    pseudonym: e.pseudonym,
    reference: e.reference,
    conditionCode: e.conditionCode,
    side: e.side,
    startDate: e.startDate,
    symptomWeeks: e.symptomWeeks,
    ageYears: e.ageYears,
    sex: e.sex,
    heightCm: e.heightCm,
    weightKg: e.weightKg,
    activityProfile: e.activityProfile,
    standingWork: e.standingWork,
    researchConsent: e.researchConsent,
    status: e.status,
    dischargeDate: e.dischargeDate,
    dischargeReason: e.dischargeReason,
    version: e.version,
    createdAt: e.createdAt.toISOString(),
    updatedAt: e.updatedAt.toISOString(),
    bmi: Math.round(value * 10) / 10,
    bmiBand: bmiBand(value),
    assessments: [...byId.values()],
    interventions: ints.map((r) => ({
      code: r.code.code,
      label: r.code.label,
      kind: r.code.kind,
      graded: r.code.graded,
      startWeek: r.i.startWeek,
      maxLevel: r.i.maxLevel,
    })),
  };
}
