import { randomBytes } from 'node:crypto';
import type { Db } from '../../server/db/client';
import {
  assessments,
  clinics,
  conditions,
  episodeInterventions,
  episodes,
  instruments,
  interventionCodes,
  scores,
} from '../../server/db/schema';
import { addDays, prng } from '../setup/fixture-tools';

export { addDays };

/**
 * An invented research dataset for the cohort and export tests: fictional clinics and episodes under a
 * condition code of their own, so a cohort on that condition sees exactly these rows whatever else the shared
 * test database holds. Deterministic (seeded), and every source row is returned so tests can check the file.
 */

export type Visit = { day: number; scores: Record<string, number> };
export type EpisodeSpec = {
  clinic: number;
  startDate: string;
  ageYears: number;
  sex: 'female' | 'male' | 'other';
  heightCm: number;
  weightKg: number;
  activityProfile: 'runner' | 'active' | 'sedentary';
  symptomWeeks: number;
  consent: boolean;
  baseline: Record<string, number>;
  followUps: Visit[];
  interventions: string[];
  dischargeDay?: number;
};
export type SourceEpisode = EpisodeSpec & { id: number; pseudonym: string; reference: string; dates: string[] };
export type Dataset = {
  tag: string;
  condition: string;
  clinics: { id: number; displayName: string; region: string; code: string }[];
  episodes: SourceEpisode[];
};

/** A plausible random episode (first-step pain falling with time, follow-ups sometimes missed). */
export function randomSpec(rand: () => number, clinic: number): EpisodeSpec {
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rand() * xs.length)]!;
  const base = 4 + Math.floor(rand() * 6);
  const speed = 0.1 + rand() * 0.5;
  const followUps: Visit[] = [];
  for (const day of [42, 84, 182]) {
    if (rand() < 0.2) continue;
    const d = day + Math.floor((rand() - 0.5) * 14);
    const pain = Math.max(0, Math.min(10, Math.round(base - (speed * d) / 7)));
    followUps.push({
      day: d,
      scores: {
        'nprs-first-step': pain,
        'nprs-usual': Math.max(0, pain - 1),
        lefs: 40 + Math.round(d / 7),
        groc: Math.round(rand() * 14) - 7,
      },
    });
  }
  return {
    clinic,
    startDate: addDays('2023-01-02', Math.floor(rand() * 700)),
    ageYears: 20 + Math.floor(rand() * 60),
    sex: pick(['female', 'male'] as const),
    // Decimal heights and weights (never .0), so a test can tell them from any other number in a file.
    heightCm: (15500 + Math.floor(rand() * 400) * 10 + 1 + Math.floor(rand() * 9)) / 100,
    weightKg: (5000 + Math.floor(rand() * 600) * 10 + 1 + Math.floor(rand() * 9)) / 100,
    activityProfile: pick(['runner', 'active', 'sedentary'] as const),
    symptomWeeks: Math.floor(rand() * 80),
    consent: rand() < 0.85,
    baseline: { 'nprs-first-step': base, 'nprs-usual': base - 1, lefs: 40 },
    followUps,
    interventions: ['education-load', ...(rand() < 0.4 ? ['toe-flexor'] : []), ...(rand() < 0.3 ? ['taping'] : [])],
    dischargeDay: rand() < 0.5 ? 120 + Math.floor(rand() * 60) : undefined,
  };
}

export function randomSpecs(n: number, nClinics: number, seed: number): EpisodeSpec[] {
  const rand = prng(seed);
  return Array.from({ length: n }, (_, i) => randomSpec(rand, i % nClinics));
}

/** Inserts clinics (with the given regions) and the episodes, with their assessments, scores and interventions. */
export async function seedDataset(db: Db, regions: string[], specs: EpisodeSpec[]): Promise<Dataset> {
  const tag = randomBytes(3).toString('hex');
  const condition = `test-research-${tag}`;
  await db.insert(conditions).values({ code: condition, label: `Invented test condition ${tag}`, icd10: 'M72.2' });
  const clinicRows = await db
    .insert(clinics)
    .values(
      regions.map((region, i) => ({
        code: `R${tag}${i}`,
        displayName: `Fictional Research Clinic ${tag}-${i}`,
        region,
      })),
    )
    .returning({ id: clinics.id, displayName: clinics.displayName, region: clinics.region, code: clinics.code });
  const inst = new Map((await db.select().from(instruments)).map((i) => [i.code, i.id]));
  const codes = new Map((await db.select().from(interventionCodes)).map((c) => [c.code, c.id]));
  const out: SourceEpisode[] = [];
  for (const [i, s] of specs.entries()) {
    const pseudonym = randomBytes(32).toString('hex');
    const reference = `RX${tag}-${i}`;
    const [e] = await db
      .insert(episodes)
      .values({
        clinicId: clinicRows[s.clinic]!.id,
        pseudonym,
        reference,
        conditionCode: condition,
        side: 'left',
        startDate: s.startDate,
        symptomWeeks: s.symptomWeeks,
        ageYears: s.ageYears,
        sex: s.sex,
        heightCm: s.heightCm,
        weightKg: s.weightKg,
        activityProfile: s.activityProfile,
        standingWork: i % 3 === 0,
        researchConsent: s.consent,
        ...(s.dischargeDay !== undefined
          ? {
              status: 'discharged' as const,
              dischargeDate: addDays(s.startDate, s.dischargeDay),
              dischargeReason: 'goals-met' as const,
            }
          : {}),
      })
      .returning({ id: episodes.id });
    const visits = [
      { day: 0, scores: s.baseline, timepoint: 'baseline' as const },
      ...s.followUps.map((v) => ({ ...v, timepoint: 'interim' as const })),
    ];
    const dates = [s.startDate, ...(s.dischargeDay !== undefined ? [addDays(s.startDate, s.dischargeDay)] : [])];
    for (const v of visits) {
      const assessedOn = addDays(s.startDate, v.day);
      dates.push(assessedOn);
      const [a] = await db
        .insert(assessments)
        .values({ episodeId: e!.id, assessedOn, timepoint: v.timepoint, reporter: 'clinician' })
        .returning({ id: assessments.id });
      await db.insert(scores).values(
        Object.entries(v.scores).map(([code, value]) => ({
          assessmentId: a!.id,
          instrumentId: inst.get(code)!,
          value,
        })),
      );
    }
    if (s.interventions.length) {
      await db
        .insert(episodeInterventions)
        .values(s.interventions.map((c) => ({ episodeId: e!.id, interventionCodeId: codes.get(c)! })));
    }
    out.push({ ...s, id: e!.id, pseudonym, reference, dates });
  }
  return { tag, condition, clinics: clinicRows, episodes: out };
}
