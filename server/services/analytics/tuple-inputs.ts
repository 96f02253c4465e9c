import {
  ageBand,
  bmi,
  bmiBand,
  kaplanMeier,
  recoveredShareAt,
  severityBand,
  symptomDurationBand,
  type EpisodeScores,
  type FollowUpWindow,
  type Obs,
} from '../../../analysis/index';
import type { RegistryRules } from '../../../shared/rules';
import type { CurvePoint } from '../../../shared/schemas/analytics';
import type { AnalyticsFilters } from '../../../shared/schemas/analytics-filters';
import type { SubgroupKey } from '../../../shared/schemas/analytics-subgroups';
import type { EpisodeTuple } from './episode-tuples';
import type { Instrument } from './context';

/** Turns the SQL tuples into the inputs of the analysis/ functions; no statistics happen here. */

export function followUpWindow(rules: RegistryRules): FollowUpWindow {
  const w = rules.primaryWindow;
  return { target: w.targetWeek, from: w.fromWeek, to: w.toWeek };
}

/** The recovery observation the SQL already reduced: event time, else censoring time; null = no assessment. */
export function recoveryObs(t: EpisodeTuple): Obs | null {
  if (t.event_weeks !== null) return { time: t.event_weeks, event: true };
  if (t.last_weeks !== null) return { time: t.last_weeks, event: false };
  return null;
}

/** Baseline plus the already chosen primary follow-up (classifyResponder re-selects it trivially). */
export function responderInput(t: Pick<EpisodeTuple, 'baseline' | 'primary_weeks' | 'primary_value'>): EpisodeScores {
  return {
    baseline: t.baseline,
    assessments:
      t.primary_weeks !== null && t.primary_value !== null ? [{ weeks: t.primary_weeks, value: t.primary_value }] : [],
  };
}

/** The level of one subgroup variable for an episode; null when it cannot be determined (or was not loaded). */
export function subgroupLevel(key: SubgroupKey, t: EpisodeTuple, instrument: Instrument): string | null {
  switch (key) {
    case 'activity':
      return t.activity_profile;
    case 'sex':
      return t.sex;
    case 'age':
      return t.age_years === null ? null : ageBand(t.age_years);
    case 'bmi':
      return t.height_cm === null || t.weight_kg === null ? null : bmiBand(bmi(t.height_cm, t.weight_kg));
    case 'duration':
      return t.symptom_weeks === null ? null : symptomDurationBand(t.symptom_weeks);
    case 'severity':
      return t.baseline === null ? null : severityBand(t.baseline, instrument);
  }
}

/** Whether the baseline severity band is asked for (grouping or narrowing), so baselines must be loaded. */
export function needsSeverity(ctx: { filters: AnalyticsFilters }, grouping = true): boolean {
  return ctx.filters.subgroup === 'severity' || (grouping && ctx.filters.groupBy === 'severity');
}

/** The subgroup facts a query must return: what the filters narrow by, plus what the endpoint groups by. */
export function factsFor(filters: AnalyticsFilters, ...extra: SubgroupKey[]): SubgroupKey[] {
  return [
    ...new Set([filters.subgroup, ...extra].filter((k): k is SubgroupKey => k !== undefined && k !== 'severity')),
  ];
}

/** Narrows the tuples to one subgroup level when the filters ask for it. */
export function restrictToSubgroup(
  tuples: EpisodeTuple[],
  filters: AnalyticsFilters,
  instrument: Instrument,
): EpisodeTuple[] {
  const { subgroup, level } = filters;
  if (!subgroup || !level) return tuples;
  return tuples.filter((t) => subgroupLevel(subgroup, t, instrument) === level);
}

/** How often the curve's table reads the share recovered (weeks). */
export const READING_STEP_WEEKS = 2;

/**
 * The cumulative recovery curve (1 − Kaplan-Meier): a point at every event time (for drawing) and readings
 * every two weeks up to the last follow-up (for the table behind the chart), both from recoveredShareAt.
 */
export function recoveryCurve(obs: Obs[]): { points: CurvePoint[]; readings: CurvePoint[] } {
  if (obs.length === 0) return { points: [], readings: [] };
  const km = kaplanMeier(obs);
  const last = km.steps[km.steps.length - 1];
  const points: CurvePoint[] = [{ weeks: 0, share: 0, lower: 0, upper: 0 }];
  for (const step of km.steps) {
    if (step.nEvent === 0 && step !== last) continue; // censor-only steps do not move the curve
    const at = recoveredShareAt(km, step.time);
    if (at.estimate === null) continue;
    points.push({ weeks: step.time, share: at.estimate, lower: at.lower, upper: at.upper });
  }
  const readings: CurvePoint[] = [];
  for (let w = READING_STEP_WEEKS; w <= (last?.time ?? 0); w += READING_STEP_WEEKS) {
    const at = recoveredShareAt(km, w);
    if (at.estimate !== null) readings.push({ weeks: w, share: at.estimate, lower: at.lower, upper: at.upper });
  }
  return { points, readings };
}
