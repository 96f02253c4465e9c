import type { FunnelPoint, TargetComparison } from './types';
import { funnelLimits } from '../funnel-limits';

/**
 * One unit on a funnel plot of a proportion.
 *
 * Counts the known outcomes of a unit (clinic), its share, the exact
 * binomial funnel limits at 95% and 99.8% around the target (Spiegelhalter
 * 2005, see `funnelLimits`; raw, unclamped) and a flag per limit pair:
 * 'above' when the share exceeds the upper limit, 'below' when it is under
 * the lower limit, else 'within'. Limits and flags are null when the unit has
 * no known outcome or the target is not strictly between 0 and 1.
 *
 * Cost: O(n) for n outcomes.
 *
 * @param outcomes - true / false per episode; null = missing (counted in `nMissing`). Not modified.
 * @param target - target proportion, or null when none can be set.
 * @throws never for valid booleans (funnel errors are avoided by the checks above).
 * @returns the funnel point.
 * @example
 * funnelPoint([true, false, true, null], 0.6); // { n: 3, count: 2, nMissing: 1, share: 0.667, ... }
 */
export function funnelPoint(outcomes: readonly (boolean | null)[], target: number | null): FunnelPoint {
  let n = 0;
  let count = 0;
  let nMissing = 0;
  for (const o of outcomes) {
    if (o === null) nMissing++;
    else {
      n++;
      if (o) count++;
    }
  }
  const share = n > 0 ? count / n : null;
  if (share === null || target === null || !(target > 0 && target < 1)) {
    return { n, count, nMissing, share, limits95: null, limits998: null, flag95: null, flag998: null };
  }
  const limits95 = funnelLimits(target, n, 0.95);
  const limits998 = funnelLimits(target, n, 0.998);
  const flag = (l: { lower: number; upper: number }): TargetComparison =>
    share > l.upper ? 'above' : share < l.lower ? 'below' : 'within';
  return { n, count, nMissing, share, limits95, limits998, flag95: flag(limits95), flag998: flag(limits998) };
}
