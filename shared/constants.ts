/** Codes the client and server agree on (labels live in the client). */
export const TIMEPOINTS = ['baseline', 'week6', 'week12', 'week26', 'discharge', 'interim'] as const;
export type Timepoint = (typeof TIMEPOINTS)[number];

/** The scheduled follow-ups and their nominal week. */
export const FOLLOW_UP_TIMEPOINTS = ['week6', 'week12', 'week26'] as const;

/** The activity continuum used in heel-pain care (common practice). */
export const ACTIVITY_PROFILES = ['runner', 'active', 'sedentary'] as const;
export type ActivityProfile = (typeof ACTIVITY_PROFILES)[number];

export const SEXES = ['female', 'male', 'other'] as const;
export const SIDES = ['left', 'right', 'both'] as const;
export const EPISODE_STATUSES = ['open', 'discharged', 'lost'] as const;
export const REPORTERS = ['clinician', 'patient'] as const;
export const DISCHARGE_REASONS = ['recovered', 'goals-met', 'self-discharge', 'referred-on', 'lost-to-follow-up'] as const;
export const INTERVENTION_KINDS = ['core', 'addon'] as const;

/** WHO adult BMI bands (WHO TRS 894, 2000), coarsened to four. */
export const BMI_BANDS = ['underweight', 'healthy', 'overweight', 'obese'] as const;

/** Symptom duration at the start of care, in bands (< 3 months, 3–12 months, > 12 months). */
export const DURATION_BANDS = ['<3m', '3-12m', '>12m'] as const;
