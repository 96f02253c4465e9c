import { ACTIVITY_PROFILES, BMI_BANDS, DURATION_BANDS, SEXES } from '../../../shared/constants';
import { SEVERITY_BANDS } from '../../../analysis/outcomes/severity-band';
import { SUBGROUP_KEYS, type SubgroupKey } from '../../../shared/schemas/analytics-subgroups';

/** Words for the subgroup variables and their levels (our own wording). */
export const SUBGROUP_LABELS: Record<SubgroupKey, string> = {
  activity: 'Activity profile',
  bmi: 'BMI band',
  age: 'Age band',
  sex: 'Sex',
  duration: 'Symptom duration',
  severity: 'Baseline severity',
};

const LEVEL_LABELS: Record<string, string> = {
  runner: 'Runners',
  active: 'Recreationally active',
  sedentary: 'Mostly sedentary',
  underweight: 'Underweight (under 18.5)',
  healthy: 'Healthy weight (18.5 to 24.9)',
  overweight: 'Overweight (25 to 29.9)',
  obese: 'Obese (30 and over)',
  female: 'Female',
  male: 'Male',
  other: 'Other',
  '<3m': 'Under 3 months',
  '3-12m': '3 to 12 months',
  '>12m': 'Over 12 months',
  mild: 'Mild',
  moderate: 'Moderate',
  severe: 'Severe',
  all: 'Everyone',
};

export function levelLabel(level: string): string {
  return LEVEL_LABELS[level] ?? level.replace('-', '–');
}

/** The natural order of each variable's levels (age bands by their lower bound). */
const KNOWN_LEVELS: Record<Exclude<SubgroupKey, 'age'>, readonly string[]> = {
  activity: ACTIVITY_PROFILES,
  bmi: BMI_BANDS,
  sex: SEXES,
  duration: DURATION_BANDS,
  severity: SEVERITY_BANDS,
};

export function sortLevels<T extends { level: string }>(key: SubgroupKey, rows: T[]): T[] {
  const rank = (l: string) => (key === 'age' ? parseInt(l, 10) : KNOWN_LEVELS[key].indexOf(l));
  return [...rows].sort((a, b) => rank(a.level) - rank(b.level));
}

/** Every subgroup level a screen can be narrowed to (age bands are too many to list as a filter). */
export const NARROW_OPTIONS = SUBGROUP_KEYS.filter((k): k is Exclude<SubgroupKey, 'age'> => k !== 'age').map((key) => ({
  key,
  label: SUBGROUP_LABELS[key],
  levels: KNOWN_LEVELS[key].map((level) => ({ level, label: levelLabel(level) })),
}));
