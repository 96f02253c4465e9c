import type { TargetComparison } from './types';

/**
 * Position of a confidence interval against a target.
 *
 * 'above' when the lower bound exceeds the target, 'below' when the upper
 * bound is under it, otherwise 'within' (the data are compatible with the
 * target). Used for the three-month expectation, e.g. "share reaching MCID by
 * week 12" against a clinic's configured target (common practice, no
 * published source). A null bound cannot support a claim on its side.
 *
 * Cost: O(1).
 *
 * @param interval - `{ lower, upper }`; bounds may be null (undefined).
 * @param target - the target value, finite.
 * @throws RangeError when `target` is not finite or lower > upper.
 * @returns 'above', 'within' or 'below'.
 * @example
 * compareWithTarget({ lower: 0.62, upper: 0.78 }, 0.5); // 'above'
 */
export function compareWithTarget(
  interval: { lower: number | null; upper: number | null },
  target: number,
): TargetComparison {
  if (!Number.isFinite(target)) throw new RangeError('compareWithTarget: target must be a finite number');
  const { lower, upper } = interval;
  if (lower !== null && upper !== null && lower > upper) {
    throw new RangeError('compareWithTarget: lower bound exceeds upper bound');
  }
  if (lower !== null && lower > target) return 'above';
  if (upper !== null && upper < target) return 'below';
  return 'within';
}
