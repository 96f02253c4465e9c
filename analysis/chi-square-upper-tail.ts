import jStat from 'jstat';

/**
 * Chi-square upper-tail probability.
 *
 * P(X >= x) for X ~ χ²(df), computed as 1 − F(x) with jstat's regularised
 * incomplete gamma. Probabilities below about 1e-13 lose relative precision
 * (and may come out as 0); that does not matter for reporting.
 *
 * Cost: O(1) (a series of bounded length inside jstat).
 *
 * @param x - the statistic, x >= 0.
 * @param df - degrees of freedom, a positive integer.
 * @throws RangeError when x is negative or not finite, or df is not a positive integer.
 * @returns the p-value in [0, 1].
 * @example
 * chiSquareUpperTail(3.841459, 1); // ≈ 0.05
 */
export function chiSquareUpperTail(x: number, df: number): number {
  if (!Number.isFinite(x) || x < 0) throw new RangeError(`chiSquareUpperTail: x must be finite and >= 0, got ${x}`);
  if (!Number.isInteger(df) || df < 1)
    throw new RangeError(`chiSquareUpperTail: df must be a positive integer, got ${df}`);
  if (x === 0) return 1;
  const p = 1 - jStat.chisquare.cdf(x, df);
  return p < 0 ? 0 : p > 1 ? 1 : p;
}
