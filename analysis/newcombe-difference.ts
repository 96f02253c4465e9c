import type { DifferenceInterval } from './types';
import { wilsonInterval } from './wilson-interval';

/**
 * Newcombe hybrid score interval for a difference of two proportions.
 *
 * Confidence interval for p₁ − p₂ from two independent binomial samples by
 * method 10 of Newcombe (1998, Stat Med 17:873–890): the Wilson limits
 * (l₁, u₁) and (l₂, u₂) of each proportion are combined by square-and-add,
 * L = d − √((p₁−l₁)² + (u₂−p₂)²), U = d + √((u₁−p₁)² + (p₂−l₂)²), d = p₁ − p₂.
 * No continuity correction (that would be method 11). The interval is not
 * degenerate when both proportions are 0 or 1, and it stays within [−1, 1].
 *
 * Cost: O(1).
 *
 * @param x1 - successes in group 1, integer, 0 <= x1 <= n1.
 * @param n1 - size of group 1, integer >= 1.
 * @param x2 - successes in group 2, integer, 0 <= x2 <= n2.
 * @param n2 - size of group 2, integer >= 1.
 * @param confLevel - in (0, 1), default 0.95.
 * @throws RangeError as {@link wilsonInterval} does for either group.
 * @returns the difference p₁ − p₂ and its limits.
 * @example
 * newcombeDifference(56, 70, 48, 80); // { difference: 0.2, lower: 0.052431, upper: 0.333873 }
 */
export function newcombeDifference(
  x1: number,
  n1: number,
  x2: number,
  n2: number,
  confLevel = 0.95,
): DifferenceInterval {
  const a = wilsonInterval(x1, n1, confLevel);
  const b = wilsonInterval(x2, n2, confLevel);
  const difference = a.estimate - b.estimate;
  const lower = difference - Math.hypot(a.estimate - a.lower, b.upper - b.estimate);
  const upper = difference + Math.hypot(a.upper - a.estimate, b.estimate - b.lower);
  return { difference, lower: Math.max(-1, lower), upper: Math.min(1, upper) };
}
