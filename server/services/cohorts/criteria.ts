import { SEVERITY_INSTRUMENT, type CohortCriteria } from '../../../shared/schemas/cohort';
import type { EpisodeFacts } from './derive';

export type CriterionStep = { key: string; label: string; keep: (f: EpisodeFacts) => boolean };

const list = (xs: readonly string[]) => xs.join(', ');

/**
 * The active criteria of a cohort as ordered steps of the flow diagram: an episode leaves at the first step it
 * fails, so "excluded" per step adds up to everything that left. Research consent is always the first step and
 * cannot be switched off (the schema refuses `researchConsent: false`, and this step ignores the field anyway).
 */
export function criteriaSteps(c: CohortCriteria): CriterionStep[] {
  const steps: CriterionStep[] = [{ key: 'consent', label: 'Research consent given', keep: (f) => f.researchConsent }];
  const add = (key: string, label: string, keep: (f: EpisodeFacts) => boolean) => steps.push({ key, label, keep });
  if (c.conditionCode) add('condition', `Condition: ${c.conditionCode}`, (f) => f.conditionCode === c.conditionCode);
  if (c.startFrom || c.startTo) {
    const from = c.startFrom;
    const to = c.startTo;
    add(
      'period',
      `Started ${from ? `from ${from}` : ''}${from && to ? ' ' : ''}${to ? `up to ${to}` : ''}`,
      (f) => (!from || f.startDate >= from) && (!to || f.startDate <= to),
    );
  }
  if (c.activityProfiles.length)
    add('activity', `Activity profile: ${list(c.activityProfiles)}`, (f) =>
      c.activityProfiles.includes(f.activityProfile as never),
    );
  if (c.bmiBands.length) add('bmi', `BMI band: ${list(c.bmiBands)}`, (f) => c.bmiBands.includes(f.bmiBand));
  if (c.ageBands.length) add('age', `Age band: ${list(c.ageBands)}`, (f) => c.ageBands.includes(f.ageBand as never));
  if (c.sexes.length) add('sex', `Sex: ${list(c.sexes)}`, (f) => c.sexes.includes(f.sex as never));
  if (c.durationBands.length)
    add('duration', `Symptom duration: ${list(c.durationBands)}`, (f) => c.durationBands.includes(f.durationBand));
  if (c.baselinePain) {
    const { min, max } = c.baselinePain;
    add('baselinePain', `First-step pain at baseline ${min}–${max}`, (f) => {
      const b = f.byInstrument.get(SEVERITY_INSTRUMENT)?.baseline ?? null;
      return b !== null && b >= min && b <= max;
    });
  }
  if (c.completeInstrument) {
    const code = c.completeInstrument;
    add('completeInstrument', `Baseline and primary follow-up on ${code}`, (f) => {
      const i = f.byInstrument.get(code);
      return i !== undefined && i.baseline !== null && i.followUp !== null;
    });
  }
  if (c.addOns) {
    const { codes, match } = c.addOns;
    add('addOns', `Add-ons received (${match === 'all' ? 'all of' : 'any of'}): ${list(codes)}`, (f) =>
      match === 'all' ? codes.every((x) => f.interventionCodes.has(x)) : codes.some((x) => f.interventionCodes.has(x)),
    );
  }
  return steps;
}

/** Index of the first step the episode fails, or -1 when it belongs to the cohort. */
export function firstFailure(steps: readonly CriterionStep[], f: EpisodeFacts): number {
  for (let i = 0; i < steps.length; i++) if (!steps[i]!.keep(f)) return i;
  return -1;
}

/** Whether evaluating the criteria needs the scores (the costly part of the facts query). */
export const needsScores = (c: CohortCriteria) => c.baselinePain !== null || c.completeInstrument !== null;
