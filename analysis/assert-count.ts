/**
 * Count guard.
 *
 * Checks that a value is a non-negative integer (a count of people), and
 * optionally that it is at least `min`.
 *
 * Cost: O(1).
 *
 * @param value - the count to check.
 * @param name - parameter name for the error message.
 * @param min - smallest allowed value, default 0.
 * @throws RangeError when `value` is not an integer or is below `min`.
 * @returns nothing.
 * @example
 * assertCount(12, 'n', 1); // ok
 * assertCount(2.5, 'n');   // throws RangeError
 */
export function assertCount(value: number, name: string, min = 0): void {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min) {
    throw new RangeError(`${name} must be an integer >= ${min}, got ${String(value)}`);
  }
}
