// Public surface of the outcomes engine. Re-exports only.
export type {
  Obs,
  GroupedObs,
  ConfType,
  KaplanMeierOptions,
  KaplanMeierStep,
  KaplanMeierResult,
  MedianTime,
  LogRankGroup,
  LogRankResult,
  ProportionInterval,
  DifferenceInterval,
  RiskRatioInterval,
  RiskStratum,
  FunnelLimits,
  BmiBand,
} from './types';
export { kaplanMeier } from './kaplan-meier';
export { logRank } from './log-rank';
export { wilsonInterval } from './wilson-interval';
export { newcombeDifference } from './newcombe-difference';
export { mantelHaenszelRiskRatio } from './mantel-haenszel-risk-ratio';
export { katzRiskRatio } from './katz-risk-ratio';
export { twoProportionTest } from './two-proportion-test';
export { benjaminiHochberg } from './benjamini-hochberg';
export { funnelLimits } from './funnel-limits';
export { bmiBand } from './bmi-band';
export { chiSquareUpperTail } from './chi-square-upper-tail';
export { solveSymmetricPsd } from './solve-symmetric-psd';

export type * from './outcomes/types';
export type { TimeToRecoveryOptions } from './outcomes/time-to-recovery';
export type { SymptomDurationBand } from './outcomes/symptom-duration-band';
export { changeScore } from './outcomes/change-score';
export { isResponder } from './outcomes/is-responder';
export { selectPrimaryFollowUp, DEFAULT_FOLLOW_UP_WINDOW } from './outcomes/select-primary-follow-up';
export { classifyResponder } from './outcomes/classify-responder';
export { responderShare } from './outcomes/responder-share';
export { summariseChange } from './outcomes/summarise-change';
export { DEFAULT_RECOVERY_RULE } from './outcomes/default-recovery-rule';
export { recoveryObservation } from './outcomes/recovery-observation';
export { recoveredShareAt } from './outcomes/recovered-share-at';
export { summariseRecoveryCurve } from './outcomes/recovery-curve-summary';
export { compareRecoveryBySubgroup } from './outcomes/recovery-by-subgroup';
export { timeToRecovery } from './outcomes/time-to-recovery';
export { compareWithTarget } from './outcomes/compare-with-target';
export { stratumKey } from './outcomes/stratum-key';
export { compareAddOn } from './outcomes/add-on-comparison';
export { addOnAssociations } from './outcomes/add-on-associations';
export { recoveredByWeek } from './outcomes/recovered-by-week';
export { funnelPoint } from './outcomes/funnel-point';
export { clinicComparison } from './outcomes/clinic-comparison';
export { ageBand } from './outcomes/age-band';
export { symptomDurationBand } from './outcomes/symptom-duration-band';
export { severityBand, SEVERITY_BANDS, type SeverityBand } from './outcomes/severity-band';
export { bmi } from './outcomes/bmi';
