/**
 * Shared input and output types of the outcomes engine. Types only: no
 * runtime code lives here.
 */

/** One right-censored observation: `time` in weeks, `event` = recovered. */
export type Obs = { time: number; event: boolean };

/** An observation tagged with the group it belongs to (for the log-rank test). */
export type GroupedObs = Obs & { group: string };

/** Transform used for the pointwise Kaplan-Meier confidence interval. */
export type ConfType = 'log' | 'log-log' | 'plain';

/** Options of {@link kaplanMeier}. */
export type KaplanMeierOptions = { confLevel?: number; confType?: ConfType };

/** One row of the Kaplan-Meier table: one per distinct observed time. */
export type KaplanMeierStep = {
  time: number;
  nRisk: number;
  nEvent: number;
  nCensor: number;
  survival: number;
  stdErr: number;
  lower: number | null;
  upper: number | null;
};

/** A median (or other summary time) with limits; `null` = not reached. */
export type MedianTime = { estimate: number | null; lower: number | null; upper: number | null };

/** Result of {@link kaplanMeier}. */
export type KaplanMeierResult = { steps: KaplanMeierStep[]; median: MedianTime };

/** Per-group line of the log-rank result. */
export type LogRankGroup = { group: string; n: number; observed: number; expected: number };

/** Result of {@link logRank}. */
export type LogRankResult = {
  chiSquare: number;
  df: number;
  pValue: number;
  groups: LogRankGroup[];
};

/** A proportion with a confidence interval. */
export type ProportionInterval = { estimate: number; lower: number; upper: number };

/** A difference of two proportions with a confidence interval. */
export type DifferenceInterval = { difference: number; lower: number; upper: number };

/** A risk ratio with a confidence interval. */
export type RiskRatioInterval = { riskRatio: number; lower: number; upper: number };

/** One 2×2 stratum: events and totals in the exposed and unexposed arms. */
export type RiskStratum = {
  exposedEvents: number;
  exposedTotal: number;
  unexposedEvents: number;
  unexposedTotal: number;
};

/** Lower and upper control limit of a funnel plot. */
export type FunnelLimits = { lower: number; upper: number };

/** WHO adult BMI band. */
export type BmiBand = 'underweight' | 'healthy' | 'overweight' | 'obese';
