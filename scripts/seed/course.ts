import type { DISCHARGE_REASONS, EPISODE_STATUSES, Timepoint } from '../../shared/constants';
import { addDays, daysBetween } from '../../shared/follow-up-schedule';
import type { DemoPatient } from './case-mix';
import { clamp, type Prng } from './prng';

export type DemoAssessment = {
  assessedOn: string;
  timepoint: Timepoint;
  reporter: 'clinician' | 'patient';
  avgDailySteps: number | null;
  adverseEvent: string | null;
  scores: Record<string, number>;
};
export type DemoCourse = {
  assessments: DemoAssessment[];
  status: (typeof EPISODE_STATUSES)[number];
  dischargeDate: string | null;
  dischargeReason: (typeof DISCHARGE_REASONS)[number] | null;
};

// Target day and spread of each follow-up, inside the registry's default windows (35–56, 70–112, 168–210).
const VISITS = [
  { timepoint: 'week6', day: 42, sd: 4, from: 35, to: 56, dropBefore: 0.1 },
  { timepoint: 'week12', day: 84, sd: 7, from: 70, to: 112, dropBefore: 0.1 },
  { timepoint: 'week26', day: 182, sd: 8, from: 168, to: 210, dropBefore: 0.12 },
] as const;

/** Scores on day `day`: first-step pain falls geometrically to 2/10 at `recoveryWeeks`, the others follow it. */
function scoresOn(r: Prng, p: DemoPatient, day: number, recoveryWeeks: number, followUp: boolean): { scores: Record<string, number>; pain: number } {
  const expected = p.firstStepPain * (2 / p.firstStepPain) ** (day / 7 / recoveryWeeks);
  const pain = Math.round(clamp(expected + r.normal(0, 0.7), 0, 10));
  const scores: Record<string, number> = {
    'nprs-first-step': pain,
    'nprs-usual': Math.round(clamp(pain - 1 + r.normal(0, 0.6), 0, 10)),
    'faam-adl': Math.round(clamp(100 - 6.5 * pain + r.normal(0, 6), 0, 100)),
  };
  if (followUp) scores.groc = Math.round(clamp((p.firstStepPain - pain) * 1.1 + r.normal(0, 1), -7, 7));
  return { scores, pain };
}

/**
 * The episode as seen today: baseline on the start date, follow-ups while the patient keeps coming
 * (10–12% stop before each), discharge when recovered (often) or after week 26; nothing after `today`.
 */
export function drawCourse(r: Prng, p: DemoPatient, startDate: string, today: string, recoveryWeeks: number): DemoCourse {
  const sinceStart = daysBetween(startDate, today);
  const baseline = { 'nprs-first-step': p.firstStepPain, 'nprs-usual': p.usualPain, 'faam-adl': p.faamAdl };
  const assessments: DemoAssessment[] = [
    { assessedOn: startDate, timepoint: 'baseline', reporter: 'clinician', avgDailySteps: r.chance(0.7) ? p.steps : null, adverseEvent: null, scores: baseline },
  ];
  for (const v of VISITS) {
    if (r.chance(v.dropBefore)) {
      // Stopped coming. Once the window has long closed, the clinic has usually marked the episode lost.
      const closedFor = sinceStart - v.to;
      if (closedFor > 30 && r.chance(0.7)) return { assessments, status: 'lost', dischargeDate: null, dischargeReason: 'lost-to-follow-up' };
      return { assessments, status: 'open', dischargeDate: null, dischargeReason: null };
    }
    const day = Math.round(clamp(r.normal(v.day, v.sd), v.from, v.to));
    if (day > sinceStart) return { assessments, status: 'open', dischargeDate: null, dischargeReason: null };
    if (r.chance(0.05) && v.timepoint !== 'week26') continue; // one visit missed, the next one kept
    const on = addDays(startDate, day);
    const { scores, pain } = scoresOn(r, p, day, recoveryWeeks, true);
    const improvement = clamp((p.firstStepPain - pain) / p.firstStepPain, 0, 1);
    assessments.push({
      assessedOn: on,
      timepoint: v.timepoint,
      reporter: r.chance(0.3) ? 'patient' : 'clinician',
      avgDailySteps: r.chance(0.6) ? Math.round(p.steps * (1 + 0.2 * improvement) * r.logNormal(1, 0.15)) : null,
      adverseEvent: r.chance(0.01) ? 'pain-flare' : null,
      scores,
    });
    if (pain <= 2 && r.chance(v.timepoint === 'week26' ? 1 : 0.55)) {
      return { assessments, status: 'discharged', dischargeDate: on, dischargeReason: r.chance(0.8) ? 'recovered' : 'goals-met' };
    }
    if (v.timepoint === 'week26') {
      if (daysBetween(on, today) < 60 && r.chance(0.3)) return { assessments, status: 'open', dischargeDate: null, dischargeReason: null };
      const reason = r.weighted(['goals-met', 'self-discharge', 'referred-on'] as const, [0.3, 0.3, 0.4]);
      return { assessments, status: 'discharged', dischargeDate: on, dischargeReason: reason };
    }
  }
  return { assessments, status: 'open', dischargeDate: null, dischargeReason: null };
}
