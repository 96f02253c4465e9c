import { ACTIVITY_PROFILES, BMI_BANDS, DURATION_BANDS, SEXES } from '../../../shared/constants';
import { AGE_BANDS } from '../../../shared/schemas/cohort';

/** Our own words for the criteria and their levels. */
export const ACTIVITY_LABELS: Record<(typeof ACTIVITY_PROFILES)[number], string> = {
  runner: 'Runners',
  active: 'Recreationally active',
  sedentary: 'Mostly sedentary',
};
export const BMI_LABELS: Record<(typeof BMI_BANDS)[number], string> = {
  underweight: 'Underweight (under 18.5)',
  healthy: 'Healthy weight (18.5–24.9)',
  overweight: 'Overweight (25–29.9)',
  obese: 'Obese (30 and over)',
};
export const SEX_LABELS: Record<(typeof SEXES)[number], string> = { female: 'Female', male: 'Male', other: 'Other' };
export const DURATION_LABELS: Record<(typeof DURATION_BANDS)[number], string> = {
  '<3m': 'Under 3 months',
  '3-12m': '3 to 12 months',
  '>12m': 'Over 12 months',
};
export const AGE_LABELS: Record<(typeof AGE_BANDS)[number], string> = Object.fromEntries(
  AGE_BANDS.map((b) => [b, b.replace('-', '–')]),
) as Record<(typeof AGE_BANDS)[number], string>;

/** The registry's conditions (one for now: the product is for heel pain). */
export const CONDITIONS = [{ code: 'plantar-heel-pain', label: 'Plantar heel pain (ICD-10 M72.2)' }];
