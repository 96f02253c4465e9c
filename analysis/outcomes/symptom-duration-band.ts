/** Symptom-duration band. */
export type SymptomDurationBand = '<3m' | '3-12m' | '>12m';

/**
 * Symptom-duration band.
 *
 * Groups the duration of symptoms before the first visit: '<3m' under 13
 * weeks, '3-12m' from 13 to 52 weeks inclusive, '>12m' over 52 weeks. Week
 * conversion: 3 months = 13 weeks (52/4) and 12 months = 52 weeks (a year is
 * 52.18 weeks, rounded down); a duration given in months should be
 * converted by the caller as months × 52/12. The 3- and 12-month cut-points
 * are a common clinical convention (common practice, no published source).
 *
 * Cost: O(1).
 *
 * @param weeks - duration in weeks, finite and >= 0.
 * @throws RangeError when `weeks` is negative or not finite.
 * @returns the band label.
 * @example
 * symptomDurationBand(12.9); // '<3m'
 * symptomDurationBand(13);   // '3-12m'
 * symptomDurationBand(53);   // '>12m'
 */
export function symptomDurationBand(weeks: number): SymptomDurationBand {
  if (typeof weeks !== 'number' || !Number.isFinite(weeks) || weeks < 0) {
    throw new RangeError(`symptomDurationBand: weeks must be a finite number >= 0, got ${String(weeks)}`);
  }
  if (weeks < 13) return '<3m';
  if (weeks <= 52) return '3-12m';
  return '>12m';
}
