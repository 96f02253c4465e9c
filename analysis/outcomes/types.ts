/**
 * Input and output types of the domain layer (`analysis/outcomes`). Types
 * only: no runtime code lives here.
 */
import type {
  DifferenceInterval,
  FunnelLimits,
  LogRankResult,
  MedianTime,
  ProportionInterval,
  RiskRatioInterval,
} from '../types';

/** One questionnaire score at a time point: `weeks` since the episode started. */
export type Assessment = { weeks: number; value: number };

/** Window for the primary follow-up: the assessment nearest `target` within [from, to] weeks. */
export type FollowUpWindow = { target: number; from: number; to: number };

/** Rule for "recovered": value <= threshold (`'atMost'`) or >= threshold (`'atLeast'`). */
export type RecoveryRule = { threshold: number; direction: 'atMost' | 'atLeast' };

/** Baseline score and follow-up assessments of one episode for one instrument. */
export type EpisodeScores = { baseline: number | null; assessments: readonly Assessment[] };

/** Options of the responder functions. */
export type ResponderOptions = {
  /** true when a higher score means a better state (e.g. LEFS); false for pain scales. */
  higherIsBetter: boolean;
  /** Improvement needed to count as a responder, in score points (usually the MCID), > 0. */
  threshold: number;
  /** Follow-up window, default { target: 12, from: 10, to: 16 }. */
  window?: FollowUpWindow;
};

/** Responder status of one episode; the two `missing-…` states are never counted as non-responders. */
export type ResponderStatus = 'responder' | 'non-responder' | 'missing-baseline' | 'missing-follow-up';

/** Per-episode responder classification. */
export type ResponderClassification = {
  status: ResponderStatus;
  /** Sign-corrected change (positive = better), or null when missing. */
  change: number | null;
  /** The assessment used as the primary follow-up, or null. */
  followUp: Assessment | null;
};

/** Responder share over many episodes, with the missing ones counted. */
export type ResponderShare = {
  nEpisodes: number;
  nMissingBaseline: number;
  nMissingFollowUp: number;
  /** Episodes with both a baseline and a primary follow-up. */
  nAnalysed: number;
  responders: number;
  /** Wilson interval of responders / nAnalysed; null when nAnalysed = 0. */
  share: ProportionInterval | null;
};

/** Summary of sign-corrected change scores. */
export type ChangeSummary = {
  n: number;
  meanChange: number;
  /** t-based CI of the mean change; null when n < 2. */
  meanChangeCi: { lower: number; upper: number } | null;
  /** SD of change (n − 1); null when n < 2. */
  sdChange: number | null;
  median: number;
  /** Quartiles by R's type-7 definition. */
  q1: number;
  q3: number;
  sdBaseline: number | null;
  /** Standardised response mean: mean change / SD of change; null when n < 2 or SD = 0. */
  srm: number | null;
  /** Effect size: mean change / SD at baseline; null when n < 2 or SD = 0. */
  effectSize: number | null;
};

/** Cumulative share recovered by a given week (1 − Kaplan-Meier). */
export type RecoveredShare = {
  weeks: number;
  /** null when the week lies beyond the last follow-up while people are still at risk. */
  estimate: number | null;
  lower: number | null;
  upper: number | null;
};

/** Kaplan-Meier summary of time to recovery for one set of episodes. */
export type RecoveryCurveSummary = {
  n: number;
  recovered: number;
  censored: number;
  atWeeks: RecoveredShare[];
  /** Median weeks to recovery with its CI (null = not reached). */
  medianWeeks: MedianTime;
};

/** One group (overall or one subgroup level) of the time-to-recovery report. */
export type RecoveryGroup = {
  level: string;
  n: number;
  /** true when n is below the minimum group size: no estimates are given. */
  tooFew: boolean;
  summary: RecoveryCurveSummary | null;
};

/** Time to recovery by the levels of one subgroup variable. */
export type RecoverySubgroupComparison = {
  key: string;
  /** Episodes without a value for this subgroup variable (excluded from it). */
  nMissingLevel: number;
  levels: RecoveryGroup[];
  /** Log-rank across the levels that are not `tooFew`; null with a note when not computable. */
  logRank: LogRankResult | null;
  logRankNote: string | null;
};

/** An episode for the time-to-recovery report. */
export type RecoveryEpisode = {
  series: readonly Assessment[];
  /** Subgroup values by variable name, e.g. { sex: 'female', durationBand: '3-12m' }. */
  subgroups?: Readonly<Record<string, string | null | undefined>>;
};

/** Result of `timeToRecovery`. */
export type TimeToRecoveryReport = {
  rule: RecoveryRule;
  nEpisodes: number;
  /** Episodes with no assessment at all (no observation can be formed). */
  nWithoutAssessments: number;
  overall: RecoveryGroup;
  subgroups: RecoverySubgroupComparison[];
};

/** Position of an interval relative to a target. */
export type TargetComparison = 'above' | 'within' | 'below';

/** An episode for the add-on association report. */
export type AddOnEpisode = {
  /** Responder status; null when missing (excluded and counted). */
  responder: boolean | null;
  /** Add-on codes recorded for the episode. */
  addOns: readonly string[];
  /** Stratum key for the Mantel-Haenszel estimate (see `stratumKey`); null if unknown. */
  stratum: string | null;
};

/** Counts of one arm. */
export type ArmCount = { n: number; responders: number; nonResponders: number };

/** Association of one add-on with responding. */
export type AddOnComparison = {
  addOn: string;
  withAddOn: ArmCount;
  withoutAddOn: ArmCount;
  /** true when an arm has fewer than the minimum: every estimate below is null. */
  suppressed: boolean;
  /** Newcombe hybrid score difference with − without. */
  riskDifference: DifferenceInterval | null;
  /** Crude risk ratio with the Katz log CI; null also when a responder count is 0. */
  riskRatio: RiskRatioInterval | null;
  /** Mantel-Haenszel risk ratio over strata; null when not estimable. */
  mhRiskRatio: RiskRatioInterval | null;
  /** Number of strata with both arms present that entered the MH estimate. */
  mhStrata: number;
  /** Episodes left out of the MH estimate because their stratum is unknown. */
  mhMissingStratum: number;
  /** Two-sided p of the two-proportion z test (Pearson χ², no continuity correction). */
  pValue: number | null;
  /** Benjamini-Hochberg adjusted p across the add-ons that have a p-value. */
  pAdjusted: number | null;
};

/** Result of `addOnAssociations`. */
export type AddOnReport = {
  nEpisodes: number;
  /** Episodes whose responder status is missing (excluded from every comparison). */
  nMissingOutcome: number;
  comparisons: AddOnComparison[];
};

/** One unit's proportion placed on a funnel plot. */
export type FunnelPoint = {
  n: number;
  count: number;
  /** Episodes with a missing outcome, excluded from n. */
  nMissing: number;
  share: number | null;
  limits95: FunnelLimits | null;
  limits998: FunnelLimits | null;
  flag95: TargetComparison | null;
  flag998: TargetComparison | null;
};

/** An episode for the clinic comparison. */
export type ClinicEpisode = { clinic: string; responder: boolean | null; recoveredBy12: boolean | null };

/** Result of `clinicComparison`. */
export type ClinicReport = {
  targets: { responder: number | null; recoveredBy12: number | null };
  clinics: { clinic: string; nEpisodes: number; responder: FunnelPoint; recoveredBy12: FunnelPoint }[];
};
