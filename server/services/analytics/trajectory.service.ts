import { sql, type SQL } from 'drizzle-orm';
import { changeScore } from '../../../analysis/index';
import type { TrajectoryResponse } from '../../../shared/schemas/analytics';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { NotFoundError } from '../../errors';
import { metaOf, publicInstrument, type AnalyticsContext } from './context';

/** A rise of this many points in first-step pain between two assessments is flagged (common practice, no source). */
export const PAIN_RISE_FLAG = 2;
const FIRST_STEP_PAIN = 'nprs-first-step';

type Row = {
  id: number;
  reference: string;
  start_date: string;
  status: string;
  aid: number | null;
  assessed_on: string | null;
  timepoint: string | null;
  weeks: number | null;
  steps: number | null;
  instrument_id: number | null;
  value: number | null;
};

/** The one query of the trajectory: the episode's assessments and scores, scoped to what the caller may see. */
export function trajectorySql(scope: Scope, episodeId: number): SQL {
  // Clinic isolation: a clinic role sees its own episodes only; an episode elsewhere is simply not found.
  const clinicCondition = scope.kind === 'clinic' ? sql`and e.clinic_id = ${scope.clinicId}` : sql``;
  const consent = scope.kind === 'registry' && scope.researcher ? sql`and e.research_consent` : sql``;
  return sql`
    select e.id, e.reference, e.start_date::text as start_date, e.status, a.id as aid, a.assessed_on::text as assessed_on,
      a.timepoint, (a.assessed_on - e.start_date)::float8 / 7 as weeks, a.avg_daily_steps as steps,
      s.instrument_id, s.value::float8 as value
    from episode e
    left join assessment a on a.episode_id = e.id and a.assessed_on >= e.start_date
    left join score s on s.assessment_id = a.id
    where e.id = ${episodeId} ${clinicCondition} ${consent}
    order by a.assessed_on, a.id, s.instrument_id`;
}

/** One episode's scores over weeks, with the MCID level from baseline, daily steps and pain-rise flags. */
export async function episodeTrajectory(
  db: Db,
  scope: Scope,
  ctx: AnalyticsContext,
  dataVersion: number,
  episodeId: number,
): Promise<TrajectoryResponse> {
  const { rows } = await db.execute<Row>(trajectorySql(scope, episodeId));
  const first = rows[0];
  if (!first) throw new NotFoundError('No such episode');

  const byInstrument = new Map<number, TrajectoryResponse['instruments'][number]['points']>();
  const baselines = new Map<number, number>();
  const steps = new Map<number, TrajectoryResponse['steps'][number]>();
  for (const r of rows) {
    if (r.aid === null || r.weeks === null || r.assessed_on === null) continue;
    if (r.steps !== null) steps.set(r.aid, { weeks: r.weeks, steps: r.steps, assessedOn: r.assessed_on });
    if (r.instrument_id === null || r.value === null) continue;
    const list = byInstrument.get(r.instrument_id) ?? [];
    list.push({ weeks: r.weeks, value: r.value, assessedOn: r.assessed_on, timepoint: r.timepoint ?? '' });
    byInstrument.set(r.instrument_id, list);
    if (r.timepoint === 'baseline') baselines.set(r.instrument_id, r.value);
  }
  const instruments = ctx.instruments
    .filter((i) => byInstrument.has(i.id))
    .map((i) => {
      const baseline = baselines.get(i.id) ?? null;
      const mcidLevel = baseline === null || i.mcid === null ? null : baseline + (i.higherIsBetter ? i.mcid : -i.mcid);
      return { instrument: publicInstrument(i), baseline, mcidLevel, points: byInstrument.get(i.id) ?? [] };
    });
  const pain = instruments.find((i) => i.instrument.code === FIRST_STEP_PAIN);
  const flags: TrajectoryResponse['flags'] = [];
  for (let k = 1; k < (pain?.points.length ?? 0); k++) {
    const prev = pain!.points[k - 1]!;
    const cur = pain!.points[k]!;
    // changeScore is positive for improvement; a rise in pain of 2 or more is a change of -2 or less.
    if (changeScore(prev.value, cur.value, false) <= -PAIN_RISE_FLAG) {
      flags.push({ weeks: cur.weeks, assessedOn: cur.assessedOn, previous: prev.value, value: cur.value });
    }
  }
  return {
    rulesVersion: ctx.rules.version,
    meta: metaOf(ctx, dataVersion),
    episode: { id: first.id, reference: first.reference, startDate: first.start_date, status: first.status },
    instruments,
    steps: [...steps.values()],
    flags,
    riseThreshold: PAIN_RISE_FLAG,
  };
}
