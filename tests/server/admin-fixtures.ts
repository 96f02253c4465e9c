import { randomBytes } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import type { Db } from '../../server/db/client';
import { assessments, auditEvents, episodes, instruments, scores } from '../../server/db/schema';
import type { Timepoint } from '../../shared/constants';

/** Fixtures of the console's tests: invented episodes written straight to the throw-away database. */

export const unique = () => randomBytes(3).toString('hex');

const addDays = (iso: string, days: number) => new Date(Date.parse(`${iso}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
export const daysAgo = (days: number) => addDays(new Date().toISOString().slice(0, 10), -days);

export async function instrumentId(db: Db, code: string): Promise<number> {
  const [row] = await db.select({ id: instruments.id }).from(instruments).where(eq(instruments.code, code));
  if (!row) throw new Error(`instrument ${code} is not in the reference data`);
  return row.id;
}

export type Visit = { weeks: number; timepoint: Timepoint; scores: Record<string, number> };

/** One invented episode starting on `startDate`, with assessments `weeks` after the start. */
export async function insertEpisode(db: Db, clinicId: number, startDate: string, visits: Visit[]): Promise<number> {
  const [ep] = await db
    .insert(episodes)
    .values({
      clinicId,
      pseudonym: randomBytes(32).toString('hex'),
      reference: `ADM-${unique()}`,
      conditionCode: 'plantar-heel-pain',
      side: 'left',
      startDate,
      symptomWeeks: 12,
      ageYears: 45,
      sex: 'female',
      heightCm: 168,
      weightKg: 70,
      activityProfile: 'active',
      standingWork: false,
      researchConsent: true,
    })
    .returning({ id: episodes.id });
  for (const v of visits) {
    const [a] = await db
      .insert(assessments)
      .values({ episodeId: ep!.id, assessedOn: addDays(startDate, v.weeks * 7), timepoint: v.timepoint, reporter: 'clinician' })
      .returning({ id: assessments.id });
    for (const [code, value] of Object.entries(v.scores)) {
      await db.insert(scores).values({ assessmentId: a!.id, instrumentId: await instrumentId(db, code), value });
    }
  }
  return ep!.id;
}

/** Audit rows written by one actor (each test file has its own steward, so counts are not disturbed). */
export async function auditCountBy(db: Db, actorId: number, entity?: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(auditEvents)
    .where(and(eq(auditEvents.actorId, actorId), entity ? eq(auditEvents.entity, entity) : undefined));
  return row?.n ?? 0;
}
