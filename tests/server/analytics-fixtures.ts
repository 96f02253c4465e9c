import { randomBytes } from 'node:crypto';
import { inArray } from 'drizzle-orm';
import type { Db } from '../../server/db/client';
import {
  assessments,
  clinics,
  episodeInterventions,
  episodes,
  instruments,
  interventionCodes,
  scores,
} from '../../server/db/schema';
import { addDays, prng } from '../setup/fixture-tools';
import { createUser } from '../setup/auth';

/**
 * Invented episodes for the analytics tests: a few fictional clinics with a deterministic pseudo-random
 * course of heel pain each (first-step pain falling over weeks, some follow-ups missed, add-ons at random).
 */

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

export type AnalyticsFixture = {
  clinicIds: number[];
  codes: string[];
  users: { lead: string; clinician: string; steward: string; researcher: string; otherLead: string };
  episodeIds: number[];
};

export async function seedAnalyticsFixture(
  db: Db,
  opts: { clinics?: number; perClinic?: number; seed?: number } = {},
): Promise<AnalyticsFixture> {
  const rand = prng(opts.seed ?? 20260301);
  const tag = randomBytes(3).toString('hex');
  const nClinics = opts.clinics ?? 3;
  const perClinic = opts.perClinic ?? 60;
  const clinicRows = await db
    .insert(clinics)
    .values(
      Array.from({ length: nClinics }, (_, i) => ({
        code: `A${tag}${i}`,
        displayName: `Analytics test clinic ${i} ${tag}`,
        region: 'Test region',
      })),
    )
    .returning({ id: clinics.id, code: clinics.code });
  const inst = await db
    .select()
    .from(instruments)
    .where(inArray(instruments.code, ['nprs-first-step', 'nprs-usual', 'faam-adl', 'lefs']));
  const byCode = new Map(inst.map((i) => [i.code, i.id]));
  const addOns = await db
    .select()
    .from(interventionCodes)
    .where(inArray(interventionCodes.code, ['toe-flexor', 'split-squats', 'taping', 'heel-cup']));
  const profiles = ['runner', 'active', 'sedentary'] as const;
  const sexes = ['female', 'male'] as const;
  const episodeIds: number[] = [];
  for (const [ci, clinic] of clinicRows.entries()) {
    const rows = Array.from({ length: perClinic }, (_, k) => {
      const start = addDays('2024-01-08', Math.floor(rand() * 540));
      return {
        clinicId: clinic.id,
        pseudonym: randomBytes(32).toString('hex'),
        reference: `T-${ci}-${k}`,
        conditionCode: 'plantar-heel-pain',
        side: 'left' as const,
        startDate: start,
        symptomWeeks: Math.floor(rand() * 80),
        ageYears: 25 + Math.floor(rand() * 45),
        sex: sexes[Math.floor(rand() * 2)]!,
        heightCm: 155 + Math.floor(rand() * 40),
        weightKg: 55 + Math.floor(rand() * 50),
        activityProfile: profiles[Math.floor(rand() * 3)]!,
        standingWork: rand() < 0.4,
        researchConsent: rand() < 0.75,
      };
    });
    const inserted = await db
      .insert(episodes)
      .values(rows)
      .returning({ id: episodes.id, startDate: episodes.startDate });
    const aRows: (typeof assessments.$inferInsert)[] = [];
    const plan: { painAt: (w: number) => number }[] = [];
    for (const e of inserted) {
      episodeIds.push(e.id);
      const base = 5 + Math.floor(rand() * 5);
      const speed = 0.15 + rand() * 0.5 + ci * 0.08; // clinics differ a little
      plan.push({ painAt: (w) => clamp(Math.round(base - speed * w + (rand() - 0.5) * 2), 0, 10) });
      aRows.push({
        episodeId: e.id,
        assessedOn: e.startDate,
        timepoint: 'baseline',
        reporter: 'clinician',
        avgDailySteps: 4000 + Math.floor(rand() * 6000),
      });
      for (const [tp, day] of [
        ['week6', 42],
        ['week12', 84],
        ['week26', 182],
      ] as const) {
        if (rand() < 0.2) continue; // missed follow-up
        const jitter = Math.floor((rand() - 0.5) * 20);
        aRows.push({
          episodeId: e.id,
          assessedOn: addDays(e.startDate, day + jitter),
          timepoint: tp,
          reporter: 'patient',
          avgDailySteps: rand() < 0.8 ? 5000 + Math.floor(rand() * 6000) : null,
        });
      }
    }
    const aIns = await db
      .insert(assessments)
      .values(aRows)
      .returning({ id: assessments.id, episodeId: assessments.episodeId, assessedOn: assessments.assessedOn });
    const startOf = new Map(inserted.map((e, i) => [e.id, { start: e.startDate, plan: plan[i]! }]));
    const sRows: (typeof scores.$inferInsert)[] = [];
    for (const a of aIns) {
      const ep = startOf.get(a.episodeId)!;
      const weeks = (Date.parse(a.assessedOn) - Date.parse(ep.start)) / (7 * 86_400_000);
      const pain = ep.plan.painAt(weeks);
      sRows.push({ assessmentId: a.id, instrumentId: byCode.get('nprs-first-step')!, value: pain });
      if (rand() < 0.9)
        sRows.push({ assessmentId: a.id, instrumentId: byCode.get('nprs-usual')!, value: clamp(pain - 1, 0, 10) });
      sRows.push({
        assessmentId: a.id,
        instrumentId: byCode.get('faam-adl')!,
        value: clamp(Math.round(100 - pain * 7 + (rand() - 0.5) * 10), 0, 100),
      });
      if (rand() < 0.7)
        sRows.push({
          assessmentId: a.id,
          instrumentId: byCode.get('lefs')!,
          value: clamp(Math.round(80 - pain * 5 + (rand() - 0.5) * 8), 0, 80),
        });
    }
    await db.insert(scores).values(sRows);
    const iRows: (typeof episodeInterventions.$inferInsert)[] = [];
    for (const e of inserted)
      for (const c of addOns) if (rand() < 0.4) iRows.push({ episodeId: e.id, interventionCodeId: c.id });
    if (iRows.length) await db.insert(episodeInterventions).values(iRows);
  }
  const ids = clinicRows.map((c) => c.id);
  const u = async (role: 'lead' | 'clinician' | 'steward' | 'researcher', clinicId: number | null) =>
    (await createUser(db, role, clinicId)).email;
  return {
    clinicIds: ids,
    codes: clinicRows.map((c) => c.code),
    users: {
      lead: await u('lead', ids[0]!),
      clinician: await u('clinician', ids[0]!),
      steward: await u('steward', null),
      researcher: await u('researcher', null),
      otherLead: await u('lead', ids[1]!),
    },
    episodeIds,
  };
}
