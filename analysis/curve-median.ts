import type { KaplanMeierStep } from './types';

/** Tolerance for "survival equals exactly 0.5" in {@link curveMedian}. */
export const MEDIAN_TOLERANCE = 1e-12;

/**
 * Median time of a step curve.
 *
 * Reads one column of a Kaplan-Meier table (`survival`, `lower` or `upper`)
 * as a right-continuous step function and returns the first time at which it
 * is <= 0.5. When the value there equals 0.5 (within 1e-12) the curve is flat
 * at exactly one half, and the median is the midpoint between that time and
 * the next time at which the curve drops further; when no such time exists
 * the time itself is returned. This is the rule printed by R
 * `survival::print.survfit` (survival 3.5). Applied to the `lower` and
 * `upper` columns it gives the limits of the median's confidence interval
 * (Brookmeyer & Crowley style, as R reports them). `null` bound values
 * (undefined, e.g. where S = 0) never count as reaching 0.5.
 *
 * Cost: O(m) for m steps.
 *
 * @param steps - Kaplan-Meier table, times ascending.
 * @param key - which column to read.
 * @throws never.
 * @returns the median time, or `null` when the column never reaches 0.5.
 * @example
 * // Bewick et al. 2004: S = 0.5 exactly on [5, 9) ⇒ 7
 * curveMedian(kaplanMeier(bewick).steps, 'survival'); // 7
 */
export function curveMedian(
  steps: readonly KaplanMeierStep[],
  key: 'survival' | 'lower' | 'upper',
): number | null {
  const m = steps.length;
  for (let i = 0; i < m; i++) {
    const step = steps[i];
    if (step === undefined) break;
    const v = step[key];
    if (v === null || Number.isNaN(v) || v > 0.5 + MEDIAN_TOLERANCE) continue;
    if (Math.abs(v - 0.5) > MEDIAN_TOLERANCE) return step.time;
    for (let j = i + 1; j < m; j++) {
      const later = steps[j];
      if (later === undefined) break;
      const w = later[key];
      if (w !== null && w < v - MEDIAN_TOLERANCE) return (step.time + later.time) / 2;
    }
    return step.time;
  }
  return null;
}
