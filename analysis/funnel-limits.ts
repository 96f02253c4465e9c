import type { FunnelLimits } from './types';
import { assertCount } from './assert-count';
import { assertConfLevel } from './assert-conf-level';
import { binomialCdfTable } from './binomial-cdf-table';

/**
 * Exact binomial funnel-plot limits for a proportion.
 *
 * Control limits around a target proportion p₀ for a unit with denominator
 * n, by the interpolated exact binomial method of Spiegelhalter (2005, Stat
 * Med 24:1185–1202, appendix A.1.1). For a tail probability q, with
 * R ~ Binomial(n, p₀) and F its CDF: r_q = smallest integer r with F(r) >= q,
 * α = (F(r_q) − q)/(F(r_q) − F(r_q − 1)) and the limit is (r_q − α)/n. The
 * tails are (1 − coverage)/2 and 1 − (1 − coverage)/2, so coverage 0.95 uses
 * 0.025/0.975 and 0.998 uses 0.001/0.999. The limits are returned raw and
 * unclamped: for small n the lower limit can be below 0 (it is when r_q = 0);
 * clamp to [0, 1] only for display.
 *
 * Cost: O(n) time and memory (one CDF table).
 *
 * @param target - the target proportion p₀, 0 < target < 1.
 * @param n - the unit's denominator, integer >= 1.
 * @param coverage - central coverage of the limits, in (0, 1), e.g. 0.95 or 0.998.
 * @throws RangeError when target is not in (0, 1), n is not a positive
 *   integer or coverage is not in (0, 1).
 * @returns `{ lower, upper }` on the proportion scale (raw, may fall outside [0, 1]).
 * @example
 * funnelLimits(0.6, 10, 0.95); // { lower: 0.229918, upper: 0.852982 }
 */
export function funnelLimits(target: number, n: number, coverage: number): FunnelLimits {
  if (typeof target !== 'number' || !Number.isFinite(target) || target <= 0 || target >= 1) {
    throw new RangeError(`funnelLimits: target must be in (0, 1), got ${String(target)}`);
  }
  assertCount(n, 'funnelLimits: n', 1);
  assertConfLevel(coverage, 'funnelLimits: coverage');
  const cdf = binomialCdfTable(n, target);
  const limit = (q: number): number => {
    let lo = 0;
    let hi = n; // F(n) = 1 >= q, so the answer lies in [0, n]
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((cdf[mid] ?? 1) >= q) hi = mid;
      else lo = mid + 1;
    }
    const fr = cdf[lo] ?? 1;
    const frPrev = lo > 0 ? (cdf[lo - 1] ?? 0) : 0;
    const alpha = (fr - q) / (fr - frPrev);
    return (lo - alpha) / n;
  };
  const tail = (1 - coverage) / 2;
  return { lower: limit(tail), upper: limit(1 - tail) };
}
