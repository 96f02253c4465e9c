import jStat from 'jstat';
import { assertConfLevel } from './assert-conf-level';

/**
 * Two-sided normal critical value.
 *
 * Returns z = Φ⁻¹(1 − (1 − confLevel)/2), the multiplier of a two-sided
 * normal-theory interval (1.959964 for 0.95, 1.644854 for 0.90). The exact
 * quantile is used, not the rounded 1.96.
 *
 * Cost: O(1).
 *
 * @param confLevel - confidence level, 0 < confLevel < 1.
 * @throws RangeError when `confLevel` is outside (0, 1) or not finite.
 * @returns the positive critical value z.
 * @example
 * twoSidedZ(0.95); // 1.959963984540054
 */
export function twoSidedZ(confLevel: number): number {
  assertConfLevel(confLevel);
  return jStat.normal.inv(1 - (1 - confLevel) / 2, 0, 1);
}
