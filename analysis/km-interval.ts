import type { ConfType } from './types';

/**
 * Pointwise Kaplan-Meier confidence interval.
 *
 * Writes the lower and upper limit of the pointwise interval for S(t) into
 * `out[0]` and `out[1]` from the Greenwood sum g = Σ d/(n(n−d)), using the
 * transforms of R `survival::survfit` (survival 3.5):
 * - `'log'`: S·exp(∓z·√g), upper truncated at 1 (R's default `conf.type`);
 * - `'log-log'`: S^exp(±z·√g/|ln S|) (R `conf.type = "log-log"`, Stata's
 *   default); undefined while S = 1 because ln S = 0;
 * - `'plain'`: S ∓ z·S·√g truncated to [0, 1].
 * Undefined limits (S = 0 for every transform, S = 1 for `'log-log'`) are
 * written as NaN. Writing into a caller-owned buffer keeps the Kaplan-Meier
 * sweep free of per-step allocations.
 *
 * Cost: O(1).
 *
 * @param survival - S(t), 0 <= S <= 1.
 * @param greenwoodSum - Σ d/(n(n−d)) up to t; finite when S > 0.
 * @param z - two-sided normal critical value (> 0).
 * @param confType - the transform.
 * @param out - buffer of length >= 2 that receives [lower, upper].
 * @throws never.
 * @returns nothing; the limits are in `out`.
 * @example
 * const out = new Float64Array(2);
 * kmInterval(0.8571428571, 0.0079365079, 1.959964, 'log', out); // out ≈ [0.719817, 1]
 */
export function kmInterval(
  survival: number,
  greenwoodSum: number,
  z: number,
  confType: ConfType,
  out: Float64Array,
): void {
  if (!(survival > 0)) {
    out[0] = NaN;
    out[1] = NaN;
    return;
  }
  const seLog = Math.sqrt(greenwoodSum);
  if (confType === 'log') {
    const f = Math.exp(z * seLog);
    const upper = survival * f;
    out[0] = survival / f;
    out[1] = upper > 1 ? 1 : upper;
  } else if (confType === 'log-log') {
    if (survival >= 1) {
      out[0] = NaN;
      out[1] = NaN;
      return;
    }
    const logS = Math.log(survival); // < 0
    const e = Math.exp((z * seLog) / -logS);
    // S^e with e > 1 is smaller than S^(1/e): the lower limit uses e.
    out[0] = Math.exp(logS * e);
    out[1] = Math.exp(logS / e);
  } else {
    const half = z * survival * seLog;
    const lower = survival - half;
    const upper = survival + half;
    out[0] = lower < 0 ? 0 : lower;
    out[1] = upper > 1 ? 1 : upper;
  }
}
