import jStat from 'jstat';
import { assertCount } from './assert-count';

/**
 * Binomial cumulative distribution table.
 *
 * Returns F(r) = P(R <= r) for r = 0…n, R ~ Binomial(n, p). The probability
 * mass at the mode comes from log-gamma (jstat `gammaln`); the other masses
 * follow by the ratio recurrence pmf(k+1)/pmf(k) = (n−k)/(k+1) · p/(1−p),
 * which cannot overflow. The lower half is summed from the bottom and the
 * upper half as 1 − (upper tail summed from the top), so both tails keep
 * their relative precision; the masses are renormalised to sum to 1. (jstat's
 * own `binomial.cdf` rounds to 1e-10, too coarse for funnel limits.)
 *
 * Cost: O(n) time and memory.
 *
 * @param n - number of trials, integer >= 1.
 * @param p - success probability, 0 < p < 1.
 * @throws RangeError when n is not a positive integer or p is not in (0, 1).
 * @returns a `Float64Array` of length n + 1 with F(0)…F(n) (F(n) = 1).
 * @example
 * binomialCdfTable(10, 0.6)[3]; // 0.0547618816
 */
export function binomialCdfTable(n: number, p: number): Float64Array {
  assertCount(n, 'binomialCdfTable: n', 1);
  if (!Number.isFinite(p) || p <= 0 || p >= 1) throw new RangeError(`binomialCdfTable: p must be in (0, 1), got ${p}`);
  const mode = Math.min(n, Math.floor((n + 1) * p));
  const pmf = new Float64Array(n + 1);
  pmf[mode] = Math.exp(
    jStat.gammaln(n + 1) -
      jStat.gammaln(mode + 1) -
      jStat.gammaln(n - mode + 1) +
      mode * Math.log(p) +
      (n - mode) * Math.log1p(-p),
  );
  const odds = p / (1 - p);
  for (let k = mode; k < n; k++) pmf[k + 1] = ((pmf[k] ?? 0) * (n - k) * odds) / (k + 1);
  for (let k = mode; k > 0; k--) pmf[k - 1] = ((pmf[k] ?? 0) * k) / ((n - k + 1) * odds);
  let total = 0;
  for (const v of pmf) total += v;
  const cdf = new Float64Array(n + 1);
  let below = 0;
  for (let r = 0; r < mode; r++) {
    below += pmf[r] ?? 0;
    cdf[r] = below / total;
  }
  let above = 0;
  for (let r = n; r >= mode; r--) {
    cdf[r] = 1 - above / total;
    above += pmf[r] ?? 0;
  }
  return cdf;
}
