/** Relative tolerance so that e.g. 0.3 − 0.1 still meets a threshold of 0.2. */
const TOLERANCE = 1e-9;

/**
 * Responder rule.
 *
 * An episode responds when its sign-corrected change is at least the
 * threshold, normally the instrument's MCID or an amount the user chose
 * (common practice, no published source). A tolerance of 1e-9 (relative to
 * the threshold) absorbs floating-point error in decimal scores.
 *
 * Cost: O(1).
 *
 * @param change - sign-corrected change (positive = better), finite.
 * @param threshold - improvement needed, finite and > 0.
 * @throws RangeError when `change` is not finite or `threshold` is not a finite positive number.
 * @returns true when change >= threshold.
 * @example
 * isResponder(2, 2);   // true
 * isResponder(1.5, 2); // false
 */
export function isResponder(change: number, threshold: number): boolean {
  if (!Number.isFinite(change)) throw new RangeError('isResponder: change must be a finite number');
  if (!Number.isFinite(threshold) || threshold <= 0) {
    throw new RangeError(`isResponder: threshold must be a finite number > 0, got ${threshold}`);
  }
  return change >= threshold - TOLERANCE * threshold;
}
