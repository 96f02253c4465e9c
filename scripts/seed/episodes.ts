import { addDays } from '../../shared/follow-up-schedule';
import { drawCourse, type DemoCourse } from './course';
import { drawInterventions, drawPatient, drawRecoveryWeeks, type DemoIntervention, type DemoPatient } from './case-mix';
import { Prng } from './prng';

/** A demo clinic as the generator needs it: its code, its share of episodes and how fast its patients recover. */
export type DemoClinicSpec = { code: string; weight: number; recoveryFactor: number };

/** One invented episode, before pseudonymisation (the local identifier stays in the generator). */
export type DemoEpisode = {
  clinicCode: string;
  localId: string;
  reference: string;
  startDate: string;
  patient: DemoPatient;
  researchConsent: boolean;
  interventions: DemoIntervention[];
  recoveryWeeks: number;
} & DemoCourse;

export type GenerateOptions = { episodes: number; seed: number; today: string; clinics: readonly DemoClinicSpec[]; days?: number };

/** Invented clinics' shares and speeds: two a little slower or faster than the rest, for clinic comparisons. */
export const DEMO_CLINIC_SPECS: readonly DemoClinicSpec[] = [
  { code: 'C01', weight: 0.24, recoveryFactor: 1 },
  { code: 'C02', weight: 0.19, recoveryFactor: 0.9 },
  { code: 'C03', weight: 0.14, recoveryFactor: 1.05 },
  { code: 'C04', weight: 0.17, recoveryFactor: 1 },
  { code: 'C05', weight: 0.14, recoveryFactor: 1.2 },
  { code: 'C06', weight: 0.12, recoveryFactor: 0.95 },
];

/**
 * The demo registry, deterministic from `seed`: episodes starting over the last two years up to `today`
 * (more in recent months), so open episodes have follow-ups due and overdue on the day it is loaded.
 * About 3% are a second episode of a patient seen before (same local identifier, so the same pseudonym).
 */
export function generateDemoEpisodes(o: GenerateOptions): DemoEpisode[] {
  const r = new Prng(o.seed);
  const days = o.days ?? 730;
  const counters = new Map<string, number>();
  const seen = new Map<string, { localId: string; patient: DemoPatient }[]>();
  const out: DemoEpisode[] = [];
  const ordered = Array.from({ length: o.episodes }, () => Math.floor(days * r.next() ** 1.2)).sort((a, b) => b - a);
  for (const back of ordered) {
    const clinic = r.weighted(o.clinics, o.clinics.map((c) => c.weight));
    const n = (counters.get(clinic.code) ?? 0) + 1;
    counters.set(clinic.code, n);
    const earlier = seen.get(clinic.code) ?? [];
    let localId: string;
    let patient = drawPatient(r);
    if (earlier.length > 20 && r.chance(0.03)) {
      const again = earlier[r.int(0, earlier.length - 1)]!;
      localId = again.localId;
      patient = { ...patient, sex: again.patient.sex, heightCm: again.patient.heightCm, ageYears: again.patient.ageYears + 1 };
      patient.bmi = (patient.weightKg * 10000) / (patient.heightCm * patient.heightCm);
    } else {
      localId = `${clinic.code}-PT${String(100000 + r.int(0, 899999))}-${n}`;
      earlier.push({ localId, patient });
      seen.set(clinic.code, earlier);
    }
    const startDate = addDays(o.today, -back);
    const recoveryWeeks = drawRecoveryWeeks(r, patient, clinic.recoveryFactor);
    out.push({
      clinicCode: clinic.code,
      localId,
      reference: `${clinic.code}-E${String(n).padStart(6, '0')}`,
      startDate,
      patient,
      researchConsent: r.chance(0.85),
      interventions: drawInterventions(r, patient),
      recoveryWeeks,
      ...drawCourse(r, patient, startDate, o.today, recoveryWeeks),
    });
  }
  return out;
}
