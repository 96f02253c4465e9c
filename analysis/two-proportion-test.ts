import { assertCount } from './assert-count';
import { chiSquareUpperTail } from './chi-square-upper-tail';

/**
 * Two-proportion z test (Pearson chi-square for a 2×2 table).
 *
 * Tests H₀: p₁ = p₂ with the pooled-variance statistic
 * z = (p₁ − p₂)/√(p̄(1−p̄)(1/n1 + 1/n2)); z² is Pearson's χ² on 1 df without
 * continuity correction, so the two-sided p equals R
 * `prop.test(correct = FALSE)` and `scipy.stats.chi2_contingency(correction = False)`.
 * When every subject (or none) has the outcome the proportions are equal by
 * construction: z = 0 and p = 1 are returned.
 *
 * Cost: O(1).
 *
 * @param x1 - successes in group 1, integer, 0 <= x1 <= n1.
 * @param n1 - size of group 1, integer >= 1.
 * @param x2 - successes in group 2, integer, 0 <= x2 <= n2.
 * @param n2 - size of group 2, integer >= 1.
 * @throws RangeError when a count is invalid or successes exceed their total.
 * @returns `{ z, chiSquare, pValue }` (two-sided p).
 * @example
 * twoProportionTest(30, 204, 21, 205).pValue; // ≈ 0.172034
 */
export function twoProportionTest(
  x1: number,
  n1: number,
  x2: number,
  n2: number,
): { z: number; chiSquare: number; pValue: number } {
  assertCount(n1, 'twoProportionTest: n1', 1);
  assertCount(n2, 'twoProportionTest: n2', 1);
  assertCount(x1, 'twoProportionTest: x1');
  assertCount(x2, 'twoProportionTest: x2');
  if (x1 > n1 || x2 > n2) throw new RangeError('twoProportionTest: successes must not exceed totals');
  const pooled = (x1 + x2) / (n1 + n2);
  if (pooled === 0 || pooled === 1) return { z: 0, chiSquare: 0, pValue: 1 };
  const z = (x1 / n1 - x2 / n2) / Math.sqrt(pooled * (1 - pooled) * (1 / n1 + 1 / n2));
  const chiSquare = z * z;
  return { z, chiSquare, pValue: chiSquareUpperTail(chiSquare, 1) };
}
