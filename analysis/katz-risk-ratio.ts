import type { RiskRatioInterval } from './types';
import { twoSidedZ } from './two-sided-z';
import { assertCount } from './assert-count';

/**
 * Crude risk ratio with the Katz log interval.
 *
 * RR = (a/n1)/(c/n0) for one 2×2 table, with the CI exp(ln RR ∓ z·SE),
 * SE = √(1/a − 1/n1 + 1/c − 1/n0) (Katz, Baptista, Azen & Pike 1978, cited from memory);
 * the same as `scipy.stats.contingency.relative_risk`
 * and R `epiR::epi.2by2` "RR.crude.wald".
 *
 * Cost: O(1).
 *
 * @param a - events among the exposed, integer, 1 <= a <= n1.
 * @param n1 - exposed total, integer >= 1.
 * @param c - events among the unexposed, integer, 1 <= c <= n0.
 * @param n0 - unexposed total, integer >= 1.
 * @param confLevel - in (0, 1), default 0.95.
 * @throws RangeError when a count is invalid, events exceed totals, an arm is
 *   empty, a or c is 0 (the log ratio is undefined), or `confLevel` is outside (0, 1).
 * @returns the risk ratio and its limits.
 * @example
 * katzRiskRatio(30, 204, 21, 205); // { riskRatio: 1.435574, lower: 0.851022, upper: 2.421645 }
 */
export function katzRiskRatio(a: number, n1: number, c: number, n0: number, confLevel = 0.95): RiskRatioInterval {
  assertCount(n1, 'katzRiskRatio: n1', 1);
  assertCount(n0, 'katzRiskRatio: n0', 1);
  assertCount(a, 'katzRiskRatio: a');
  assertCount(c, 'katzRiskRatio: c');
  if (a > n1 || c > n0) throw new RangeError('katzRiskRatio: events must not exceed totals');
  if (a === 0 || c === 0) throw new RangeError('katzRiskRatio: a zero event count makes the log risk ratio undefined');
  const z = twoSidedZ(confLevel);
  const riskRatio = a / n1 / (c / n0);
  const se = Math.sqrt(1 / a - 1 / n1 + 1 / c - 1 / n0);
  return { riskRatio, lower: riskRatio * Math.exp(-z * se), upper: riskRatio * Math.exp(z * se) };
}
