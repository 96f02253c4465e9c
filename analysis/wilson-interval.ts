import type { ProportionInterval } from './types';
import { twoSidedZ } from './two-sided-z';
import { assertCount } from './assert-count';

/**
 * Wilson score interval for one proportion.
 *
 * The interval for a binomial proportion obtained by inverting the score
 * test (Wilson 1927, cited from memory), without continuity correction: method 3 of Newcombe
 * (1998, Stat Med 17:857–872); the same as R `prop.test(x, n, correct = FALSE)`.
 * Limits: (2np + z² ∓ z√(z² + 4np(1−p))) / (2(n + z²)). Unlike the Wald
 * interval it stays inside [0, 1] and is not degenerate at 0 or n successes.
 *
 * Cost: O(1).
 *
 * @param successes - integer, 0 <= successes <= n.
 * @param n - number of trials, integer >= 1.
 * @param confLevel - in (0, 1), default 0.95.
 * @throws RangeError when a count is not an integer, n < 1, successes > n or
 *   `confLevel` is outside (0, 1).
 * @returns the estimate x/n and the lower and upper limits.
 * @example
 * wilsonInterval(81, 263); // { estimate: 0.30798, lower: 0.255289, upper: 0.366210 }
 */
export function wilsonInterval(successes: number, n: number, confLevel = 0.95): ProportionInterval {
  assertCount(n, 'wilsonInterval: n', 1);
  assertCount(successes, 'wilsonInterval: successes');
  if (successes > n) throw new RangeError(`wilsonInterval: successes (${successes}) must not exceed n (${n})`);
  const z = twoSidedZ(confLevel);
  const p = successes / n;
  const z2 = z * z;
  const centre = 2 * n * p + z2;
  const half = z * Math.sqrt(z2 + 4 * n * p * (1 - p));
  const denom = 2 * (n + z2);
  return {
    estimate: p,
    lower: successes === 0 ? 0 : Math.max(0, (centre - half) / denom),
    upper: successes === n ? 1 : Math.min(1, (centre + half) / denom),
  };
}
