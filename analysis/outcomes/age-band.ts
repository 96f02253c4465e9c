/**
 * Five-year age band.
 *
 * Bands '0-4', '5-9', …, '85-89' by completed years, with everyone aged 90 or
 * more top-coded as '90+' (five-year groups as in common census and registry
 * reporting; the 90+ top code limits re-identification; common practice, no
 * published source). Fractional ages are floored to completed years.
 *
 * Cost: O(1).
 *
 * @param ageYears - age in years, finite and >= 0.
 * @throws RangeError when `ageYears` is negative or not finite.
 * @returns the band label.
 * @example
 * ageBand(42);   // '40-44'
 * ageBand(93.5); // '90+'
 */
export function ageBand(ageYears: number): string {
  if (typeof ageYears !== 'number' || !Number.isFinite(ageYears) || ageYears < 0) {
    throw new RangeError(`ageBand: age must be a finite number >= 0, got ${String(ageYears)}`);
  }
  if (ageYears >= 90) return '90+';
  const lower = Math.floor(Math.floor(ageYears) / 5) * 5;
  return `${lower}-${lower + 4}`;
}
