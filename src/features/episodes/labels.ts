import type {
  ACTIVITY_PROFILES,
  BMI_BANDS,
  DISCHARGE_REASONS,
  EPISODE_STATUSES,
  REPORTERS,
  SEXES,
  SIDES,
  Timepoint,
} from '../../../shared/constants';

// Our own words for the codes the client and server share (codes live in shared/constants).

export const STATUS_LABELS: Record<(typeof EPISODE_STATUSES)[number], string> = {
  open: 'In care',
  discharged: 'Discharged',
  lost: 'Lost to follow-up',
};

export const TIMEPOINT_LABELS: Record<Timepoint, string> = {
  baseline: 'Start of care',
  week6: 'Week 6',
  week12: 'Week 12',
  week26: 'Week 26',
  discharge: 'At discharge',
  interim: 'Extra check',
};

export const DISCHARGE_REASON_LABELS: Record<(typeof DISCHARGE_REASONS)[number], string> = {
  recovered: 'Recovered',
  'goals-met': 'Reached the goals agreed',
  'self-discharge': 'Chose to stop coming',
  'referred-on': 'Referred to another service',
  'lost-to-follow-up': 'Could no longer be reached',
};

export const ACTIVITY_LABELS: Record<(typeof ACTIVITY_PROFILES)[number], string> = {
  runner: 'Runner',
  active: 'Active, not running',
  sedentary: 'Mostly sitting',
};

export const SEX_LABELS: Record<(typeof SEXES)[number], string> = { female: 'Female', male: 'Male', other: 'Other' };
export const SIDE_LABELS: Record<(typeof SIDES)[number], string> = { left: 'Left', right: 'Right', both: 'Both heels' };
export const REPORTER_LABELS: Record<(typeof REPORTERS)[number], string> = {
  clinician: 'Clinician entered',
  patient: 'Patient reported',
};

/** WHO adult bands (WHO TRS 894, 2000) with their cut-offs in kg/m². */
export const BMI_BAND_LABELS: Record<(typeof BMI_BANDS)[number], string> = {
  underweight: 'Underweight (below 18.5)',
  healthy: 'Healthy range (18.5 to 24.9)',
  overweight: 'Overweight (25 to 29.9)',
  obese: 'Obese (30 or more)',
};

/** Options for a <select> from a label map, in the order of the code list. */
export function optionsOf<K extends string>(codes: readonly K[], labels: Record<K, string>) {
  return codes.map((code) => ({ value: code, label: labels[code] }));
}
