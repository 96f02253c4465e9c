/**
 * Confidence-level guard.
 *
 * Checks that a confidence level is a finite number strictly between 0 and 1
 * (0.95 means a 95% interval). Used by every interval function so that they
 * all fail the same way.
 *
 * Cost: O(1).
 *
 * @param confLevel - the level to check; must satisfy 0 < confLevel < 1.
 * @param name - the parameter name used in the error message.
 * @throws RangeError when `confLevel` is not finite or not in (0, 1).
 * @returns nothing; returns normally when the level is valid.
 * @example
 * assertConfLevel(0.95); // ok
 * assertConfLevel(95);   // throws RangeError
 */
export function assertConfLevel(confLevel: number, name = 'confLevel'): void {
  if (typeof confLevel !== 'number' || !Number.isFinite(confLevel) || confLevel <= 0 || confLevel >= 1) {
    throw new RangeError(`${name} must be a number strictly between 0 and 1, got ${String(confLevel)}`);
  }
}
