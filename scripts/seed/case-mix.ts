import type { ActivityProfile } from '../../shared/constants';
import { clamp, type Prng } from './prng';

/** An invented patient at the start of an episode (no real person; figures are plausible, not sourced). */
export type DemoPatient = {
  sex: 'female' | 'male' | 'other';
  ageYears: number;
  heightCm: number;
  weightKg: number;
  bmi: number;
  activityProfile: ActivityProfile;
  standingWork: boolean;
  side: 'left' | 'right' | 'both';
  symptomWeeks: number;
  chronic: boolean;
  firstStepPain: number;
  usualPain: number;
  faamAdl: number;
  steps: number;
};

const PROFILES = ['runner', 'active', 'sedentary'] as const;
// Runners younger and leaner, sedentary people older and heavier (the heel-pain case-mix; invented numbers).
const AGE = { runner: [39, 9, 18, 70], active: [48, 11, 18, 82], sedentary: [56, 11, 20, 88] } as const;
const BMI = { runner: [23, 2, 17.5, 32], active: [26.5, 3.2, 18, 40], sedentary: [30.5, 4.5, 19, 50] } as const;
const HEIGHT = { female: [165, 6.5], male: [178, 7], other: [171, 8] } as const;
const STEPS = { runner: 9000, active: 7000, sedentary: 4200 } as const;

export function drawPatient(r: Prng): DemoPatient {
  const activityProfile = r.weighted(PROFILES, [0.28, 0.37, 0.35]);
  const sex = r.weighted(['female', 'male', 'other'] as const, [0.6, 0.39, 0.01]);
  const [am, asd, alo, ahi] = AGE[activityProfile];
  const [bm, bsd, blo, bhi] = BMI[activityProfile];
  const [hm, hsd] = HEIGHT[sex];
  const heightCm = Math.round(clamp(r.normal(hm, hsd), 145, 205));
  const bmiTarget = clamp(r.normal(bm, bsd), blo, bhi);
  const weightKg = Math.round(bmiTarget * (heightCm / 100) ** 2 * 10) / 10;
  const symptomWeeks = Math.round(clamp(r.logNormal(12, 0.8), 1, 520));
  const chronic = symptomWeeks >= 26;
  const firstStepPain = Math.round(clamp(r.normal(6.8 + (chronic ? 0.4 : 0), 1.4), 3, 10));
  return {
    sex,
    ageYears: Math.round(clamp(r.normal(am, asd), alo, ahi)),
    heightCm,
    weightKg,
    bmi: (weightKg * 10000) / (heightCm * heightCm),
    activityProfile,
    standingWork: r.chance(activityProfile === 'runner' ? 0.25 : 0.4),
    side: r.weighted(['right', 'left', 'both'] as const, [0.45, 0.4, 0.15]),
    symptomWeeks,
    chronic,
    firstStepPain,
    usualPain: Math.round(clamp(firstStepPain - r.normal(1.5, 0.8), 1, 10)),
    faamAdl: Math.round(clamp(100 - 6.5 * firstStepPain + r.normal(0, 8), 10, 98)),
    steps: Math.round(STEPS[activityProfile] * r.logNormal(1, 0.25)),
  };
}

/**
 * Weeks until first-step pain reaches 2/10: about three months for most, with a long tail. Slower when
 * chronic, sedentary, heavier, bilateral or more painful at the start; faster for runners. Invented factors.
 */
export function drawRecoveryWeeks(r: Prng, p: DemoPatient, clinicFactor: number): number {
  let f = clinicFactor;
  if (p.chronic) f *= 1.5;
  if (p.activityProfile === 'sedentary') f *= 1.2;
  if (p.activityProfile === 'runner') f *= 0.9;
  if (p.bmi >= 30) f *= 1.15;
  if (p.side === 'both') f *= 1.3;
  if (p.sex === 'female') f *= 1.08;
  if (p.firstStepPain >= 8) f *= 1.1;
  return clamp(r.logNormal(9.5, 0.6) * f, 2, 200);
}

export type DemoIntervention = { code: string; startWeek: number; maxLevel: number | null };

const ADDONS_BY_PROFILE: Record<ActivityProfile, [string, number][]> = {
  runner: [['dynamic-warm-up', 3], ['split-squats', 3], ['single-leg-balance', 2], ['footwear-change', 2], ['toe-flexor', 1], ['toe-isolation', 1], ['taping', 1]],
  active: [['toe-flexor', 2], ['split-squats', 2], ['single-leg-balance', 2], ['footwear-change', 2], ['taping', 2], ['heel-cup', 1], ['toe-isolation', 1]],
  sedentary: [['heel-cup', 3], ['footwear-change', 2], ['taping', 2], ['toe-flexor', 2], ['night-splint', 1], ['toe-isolation', 1], ['single-leg-balance', 1]],
};
const GRADED = new Set(['heel-raises', 'split-squats', 'single-leg-balance']);

/**
 * Core programme for nearly everyone; add-ons given more often to chronic, sedentary, heavier and more
 * painful cases (confounding by indication). Add-ons have no effect on recovery in the demo: any
 * association the dashboards show is that confounding.
 */
export function drawInterventions(r: Prng, p: DemoPatient): DemoIntervention[] {
  const level = () => r.weighted([1, 2, 3], p.activityProfile === 'runner' ? [1, 2, 3] : [3, 2, 1]);
  const out: DemoIntervention[] = [{ code: 'education-load', startWeek: 0, maxLevel: null }];
  if (r.chance(0.88)) out.push({ code: 'fascia-stretch', startWeek: 0, maxLevel: null });
  if (r.chance(0.8)) out.push({ code: 'heel-raises', startWeek: r.chance(0.7) ? 0 : r.int(1, 3), maxLevel: level() });
  const lambda = 0.5 + (p.chronic ? 0.9 : 0) + (p.activityProfile === 'sedentary' ? 0.6 : 0) + (p.firstStepPain >= 8 ? 0.4 : 0) + (p.bmi >= 30 ? 0.3 : 0);
  const pool = [...ADDONS_BY_PROFILE[p.activityProfile]];
  for (let n = Math.min(r.poisson(lambda), pool.length); n > 0; n--) {
    const [code] = r.weighted(pool, pool.map(([, w]) => w));
    pool.splice(pool.findIndex(([c]) => c === code), 1);
    out.push({ code, startWeek: r.chance(0.6) ? 0 : r.int(2, 8), maxLevel: GRADED.has(code) ? level() : null });
  }
  return out;
}
