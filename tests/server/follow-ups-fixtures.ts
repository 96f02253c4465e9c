import { randomBytes } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import type { Db } from '../../server/db/client';
import { assessments, clinics, episodes, instruments, scores } from '../../server/db/schema';
import type { Timepoint } from '../../shared/constants';
import { addDays, todayUtc } from '../../shared/follow-up-schedule';

// Invented test data for the follow-up tests: each file makes its own clinic, so files never see each other's rows.

export const today = () => todayUtc();
/** The date `days` days before today (UTC calendar). */
export const daysAgo = (days: number) => addDays(todayUtc(), -days);

export async function makeClinic(db: Db, name = 'Test clinic') {
  const code = `T${randomBytes(4).toString('hex')}`;
  const [row] = await db
    .insert(clinics)
    .values({ code, displayName: `${name} ${code}`, region: 'Test region' })
    .returning();
  return row!;
}

type AssessmentSpec = {
  timepoint: Timepoint;
  assessedOn: string;
  scores?: Record<string, number>;
  steps?: number | null;
};
type EpisodeSpec = {
  startDate: string;
  status?: 'open' | 'discharged' | 'lost';
  dischargeDate?: string | null;
  dischargeReason?: 'recovered' | 'lost-to-follow-up' | null;
  /** Defaults to a baseline on the start date with first-step pain 7 and function 52.5. */
  assessments?: AssessmentSpec[];
  reference?: string;
};

const pseudonym = () => randomBytes(32).toString('hex');

async function instrumentId(db: Db, code: string): Promise<number> {
  const [row] = await db.select({ id: instruments.id }).from(instruments).where(eq(instruments.code, code));
  if (!row) throw new Error(`instrument ${code} is not in the reference data`);
  return row.id;
}

/** An episode straight into the database (the episode API is not under test here). */
export async function makeEpisode(db: Db, clinicId: number, spec: EpisodeSpec) {
  const [episode] = await db
    .insert(episodes)
    .values({
      clinicId,
      pseudonym: pseudonym(),
      reference: spec.reference ?? `EP-${randomBytes(3).toString('hex')}`,
      conditionCode: 'plantar-heel-pain',
      side: 'left',
      startDate: spec.startDate,
      symptomWeeks: 10,
      ageYears: 45,
      sex: 'female',
      heightCm: 168,
      weightKg: 70,
      activityProfile: 'active',
      standingWork: false,
      researchConsent: true,
      status: spec.status ?? 'open',
      dischargeDate: spec.dischargeDate ?? null,
      dischargeReason: spec.dischargeReason ?? null,
    })
    .returning();
  const list = spec.assessments ?? [
    { timepoint: 'baseline', assessedOn: spec.startDate, scores: { 'nprs-first-step': 7, 'faam-adl': 52.5 } },
  ];
  for (const a of list) {
    const [row] = await db
      .insert(assessments)
      .values({
        episodeId: episode!.id,
        timepoint: a.timepoint,
        assessedOn: a.assessedOn,
        reporter: 'clinician',
        avgDailySteps: a.steps ?? null,
      })
      .returning({ id: assessments.id });
    for (const [code, value] of Object.entries(a.scores ?? {})) {
      await db.insert(scores).values({ assessmentId: row!.id, instrumentId: await instrumentId(db, code), value });
    }
  }
  return episode!;
}

/** Row counts of the tables a refused request must leave alone. */
export async function counts(db: Db) {
  const one = async (table: string) =>
    (await db.execute<{ n: number }>(sql.raw(`select count(*)::int as n from ${table}`))).rows[0]!.n;
  return {
    assessment: await one('assessment'),
    score: await one('score'),
    audit: await one('audit_event'),
    usedLinks: await one('self_report_link where used_at is not null'),
    links: await one('self_report_link'),
  };
}
