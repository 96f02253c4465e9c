import type { ConfType } from './types';

/**
 * One pointwise Kaplan-Meier confidence bound.
 *
 * Computes the lower (`side = -1`) or upper (`side = 1`) limit of the
 * pointwise interval for S(t) from the Greenwood sum g = Σ d/(n(n−d)), using
 * the transforms of R `survival::survfit` (Therneau, survival 3.x):
 * - `'log'`: S·exp(±z·√g), upper truncated at 1 (R's default `conf.type`);
 * - `'log-log'`: S^exp(∓z·√g/|ln S|) (R `conf.type = "log-log"`, Stata's
 *   default); undefined while S = 1 because ln S = 0;
 * - `'plain'`: S ± z·S·√g truncated to [0, 1].
 *
 * Cost: O(1).
 *
 * @param survival - S(t), 0 <= S <= 1.
 * @param greenwoodSum - Σ d/(n(n−d)) up to t; finite when S > 0.
 * @param z - two-sided normal critical value (> 0).
 * @param confType - the transform.
 * @param side - -1 for the lower bound, 1 for the upper bound.
 * @throws never.
 * @returns the bound, or `null` where it is undefined (S = 0 for every
 *   transform, S = 1 for `'log-log'`).
 * @example
 * kmBound(0.8571428571, 0.0079365079, 1.959964, 'log', -1); // ≈ 0.719817
 */
export function kmBound(
  survival: number,
  greenwoodSum: number,
  z: number,
  confType: ConfType,
  side: -1 | 1,
): number | null {
  if (!(survival > 0)) return null;
  const seLog = Math.sqrt(greenwoodSum);
  if (confType === 'log') {
    const b = survival * Math.exp(side * z * seLog);
    return b > 1 ? 1 : b;
  }
  if (confType === 'log-log') {
    if (survival >= 1) return null;
    // ln S < 0, so a larger exponent gives a smaller value: the lower bound uses +z.
    return Math.pow(survival, Math.exp((-side * z * seLog) / -Math.log(survival)));
  }
  const b = survival + side * z * survival * seLog;
  return b < 0 ? 0 : b > 1 ? 1 : b;
}
