/**
 * The subgroup variables of the outcome dashboards: codes the client and server agree on.
 * The banding functions themselves live in analysis/ (bmiBand, ageBand, symptomDurationBand, severityBand).
 */
export const SUBGROUP_KEYS = ['activity', 'bmi', 'age', 'sex', 'duration', 'severity'] as const;
export type SubgroupKey = (typeof SUBGROUP_KEYS)[number];
