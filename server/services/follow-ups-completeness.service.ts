import { and, gte, inArray, ne } from 'drizzle-orm';
import { FOLLOW_UP_TIMEPOINTS } from '../../shared/constants';
import {
  addDays,
  completingAssessment,
  type AssessmentMark,
  type FollowUpTimepoint,
  type FollowUpWindows,
} from '../../shared/follow-up-schedule';
import type { Completeness } from '../../shared/schemas/follow-ups';
import type { Db } from '../db/client';
import type { Scope } from '../db/scope';
import { assessments, episodes } from '../db/schema';
import { clinicIdOf } from './follow-ups.service';
import { currentRules } from './rules.service';

type EpisodeRow = {
  id: number;
  clinicId: number;
  startDate: string;
  dischargeDate: string | null;
  dischargeReason: string | null;
};

/**
 * Whether a follow-up was expected: its window closed inside the period, and care had not ended (other than by
 * losing touch) before the window opened. A patient discharged as recovered at week 4 owes no week-6 report;
 * one who stopped answering does. (Registry convention, common practice.)
 */
export function expectedFollowUp(e: EpisodeRow, opensOn: string, closesOn: string, from: string, to: string): boolean {
  if (closesOn < from || closesOn > to) return false;
  const endedEarly = e.dischargeDate !== null && e.dischargeDate < opensOn && e.dischargeReason !== 'lost-to-follow-up';
  return !endedEarly;
}

type Tally = { expected: number; completed: number };
const share = (t: Tally) => ({ ...t, share: t.expected === 0 ? null : t.completed / t.expected });

/**
 * GET /api/follow-ups/completeness: for each timepoint, the share of expected follow-ups with an assessment,
 * in the caller's clinic and across the registry, over windows that closed in the 12 months up to yesterday.
 * The registry figure is a single share over all clinics: no other clinic is named or counted on its own.
 */
export async function completeness(db: Db, scope: Scope, today: string): Promise<Completeness> {
  const clinicId = clinicIdOf(scope);
  const { rules } = await currentRules(db);
  const windows: FollowUpWindows = rules.followUpWindows;
  const to = addDays(today, -1);
  const from = addDays(today, -365);
  const longest = Math.max(...FOLLOW_UP_TIMEPOINTS.map((t) => windows[t].toDay));
  const rows: EpisodeRow[] = await db
    .select({
      id: episodes.id,
      clinicId: episodes.clinicId,
      startDate: episodes.startDate,
      dischargeDate: episodes.dischargeDate,
      dischargeReason: episodes.dischargeReason,
    })
    .from(episodes)
    .where(gte(episodes.startDate, addDays(from, -longest)));
  const marks = new Map<number, AssessmentMark[]>();
  const ids = rows.map((r) => r.id);
  for (let i = 0; i < ids.length; i += 5000) {
    const found = await db
      .select({
        episodeId: assessments.episodeId,
        timepoint: assessments.timepoint,
        assessedOn: assessments.assessedOn,
      })
      .from(assessments)
      .where(and(inArray(assessments.episodeId, ids.slice(i, i + 5000)), ne(assessments.timepoint, 'baseline')));
    for (const m of found) marks.set(m.episodeId, [...(marks.get(m.episodeId) ?? []), m]);
  }

  const timepoints = FOLLOW_UP_TIMEPOINTS.map((timepoint: FollowUpTimepoint) => {
    const clinic: Tally = { expected: 0, completed: 0 };
    const registry: Tally = { expected: 0, completed: 0 };
    for (const e of rows) {
      const opensOn = addDays(e.startDate, windows[timepoint].fromDay);
      const closesOn = addDays(e.startDate, windows[timepoint].toDay);
      if (!expectedFollowUp(e, opensOn, closesOn, from, to)) continue;
      const done = completingAssessment(timepoint, opensOn, closesOn, marks.get(e.id) ?? []) !== undefined;
      for (const t of e.clinicId === clinicId ? [clinic, registry] : [registry]) {
        t.expected += 1;
        if (done) t.completed += 1;
      }
    }
    return { timepoint, clinic: share(clinic), registry: share(registry) };
  });
  return { from, to, target: rules.completenessTarget, minCell: rules.minCellEstimate, timepoints };
}
