import { and, eq, gt, inArray, isNull, max, sql } from 'drizzle-orm';
import {
  followUpSchedule,
  type AssessmentMark,
  type FollowUpState,
  type FollowUpWindows,
} from '../../shared/follow-up-schedule';
import { FollowUpListQuerySchema, type FollowUpItem, type FollowUpList } from '../../shared/schemas/follow-ups';
import type { Db } from '../db/client';
import type { Scope } from '../db/scope';
import { assessments, episodes, selfReportLinks } from '../db/schema';
import { ForbiddenError } from '../errors';
import { currentRules } from './rules.service';

/** Follow-ups are a clinic's own work: only a clinic scope has them. */
export function clinicIdOf(scope: Scope): number {
  if (scope.kind !== 'clinic') throw new ForbiddenError('Follow-ups belong to a clinic; sign in with a clinic account');
  return scope.clinicId;
}

export type OpenEpisode = {
  id: number;
  reference: string;
  startDate: string;
  version: number;
  marks: AssessmentMark[];
  lastAssessedOn: string | null;
};

/** A clinic's open episodes with the timepoints and dates of their assessments (never their scores). */
export async function openEpisodesOf(db: Db, clinicId: number): Promise<OpenEpisode[]> {
  const rows = await db
    .select({
      id: episodes.id,
      reference: episodes.reference,
      startDate: episodes.startDate,
      version: episodes.version,
    })
    .from(episodes)
    .where(and(eq(episodes.clinicId, clinicId), eq(episodes.status, 'open')));
  if (rows.length === 0) return [];
  const marks = await db
    .select({ episodeId: assessments.episodeId, timepoint: assessments.timepoint, assessedOn: assessments.assessedOn })
    .from(assessments)
    .innerJoin(episodes, eq(episodes.id, assessments.episodeId))
    .where(and(eq(episodes.clinicId, clinicId), eq(episodes.status, 'open')));
  const byEpisode = new Map<number, AssessmentMark[]>();
  for (const m of marks) {
    const list = byEpisode.get(m.episodeId) ?? [];
    list.push({ timepoint: m.timepoint, assessedOn: m.assessedOn });
    byEpisode.set(m.episodeId, list);
  }
  return rows.map((r) => {
    const own = byEpisode.get(r.id) ?? [];
    const last = own.reduce<string | null>((acc, m) => (acc === null || m.assessedOn > acc ? m.assessedOn : acc), null);
    return { ...r, marks: own, lastAssessedOn: last };
  });
}

/** Every scheduled follow-up of a clinic's open episodes whose state is one of `states`, as seen on `today`. */
export async function followUpsOfClinic(
  db: Db,
  clinicId: number,
  today: string,
  windows: FollowUpWindows,
  states: readonly FollowUpState[],
): Promise<Omit<FollowUpItem, 'linkExpiresAt'>[]> {
  const open = await openEpisodesOf(db, clinicId);
  return open.flatMap((e) =>
    followUpSchedule(e.startDate, today, windows, e.marks)
      .filter((f) => states.includes(f.state))
      .map((f) => ({
        episodeId: e.id,
        reference: e.reference,
        startDate: e.startDate,
        timepoint: f.timepoint,
        state: f.state,
        opensOn: f.opensOn,
        closesOn: f.closesOn,
        daysLeft: f.daysLeft,
      })),
  );
}

/** Unused, unexpired self-report links of these episodes: "episodeId:timepoint" → latest expiry. */
async function waitingLinks(db: Db, clinicId: number, episodeIds: number[]): Promise<Map<string, string>> {
  if (episodeIds.length === 0) return new Map();
  const rows = await db
    .select({
      episodeId: selfReportLinks.episodeId,
      timepoint: selfReportLinks.timepoint,
      until: max(selfReportLinks.expiresAt),
    })
    .from(selfReportLinks)
    .innerJoin(episodes, eq(episodes.id, selfReportLinks.episodeId))
    .where(
      and(
        eq(episodes.clinicId, clinicId),
        inArray(selfReportLinks.episodeId, episodeIds),
        isNull(selfReportLinks.usedAt),
        gt(selfReportLinks.expiresAt, sql`now()`),
      ),
    )
    .groupBy(selfReportLinks.episodeId, selfReportLinks.timepoint);
  return new Map(rows.map((r) => [`${r.episodeId}:${r.timepoint}`, r.until ? new Date(r.until).toISOString() : '']));
}

const TIMEPOINT_ORDER = { week6: 0, week12: 1, week26: 2 } as const;

/** GET /api/follow-ups: the caller's clinic, filtered by state, sorted and paged here (the schedule is computed, not stored). */
export async function listFollowUps(db: Db, scope: Scope, rawQuery: unknown, today: string): Promise<FollowUpList> {
  const clinicId = clinicIdOf(scope);
  const q = FollowUpListQuerySchema.parse(rawQuery);
  const { rules } = await currentRules(db);
  const all = await followUpsOfClinic(db, clinicId, today, rules.followUpWindows, q.state);
  const key = (f: (typeof all)[number]): string | number =>
    q.sort === 'timepoint'
      ? TIMEPOINT_ORDER[f.timepoint]
      : q.sort === 'reference'
        ? f.reference.toLowerCase()
        : f[q.sort];
  const dir = q.order === 'asc' ? 1 : -1;
  all.sort((a, b) => {
    const ka = key(a);
    const kb = key(b);
    if (ka !== kb) return ka < kb ? -dir : dir;
    return a.closesOn.localeCompare(b.closesOn) || a.reference.localeCompare(b.reference) || a.episodeId - b.episodeId;
  });
  const page = all.slice(q.offset, q.offset + q.limit);
  const links = await waitingLinks(db, clinicId, [...new Set(page.map((f) => f.episodeId))]);
  return {
    items: page.map((f) => ({ ...f, linkExpiresAt: links.get(`${f.episodeId}:${f.timepoint}`) ?? null })),
    total: all.length,
    today,
  };
}
