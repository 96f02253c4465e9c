/**
 * Observation-time guard.
 *
 * Checks that a survival time is a finite, non-negative number (weeks since
 * the start of the episode). Shared by Kaplan-Meier and the log-rank test.
 *
 * Cost: O(1).
 *
 * @param time - the value to check.
 * @param index - position of the observation, for the error message.
 * @param caller - name of the calling function, for the error message.
 * @throws RangeError when `time` is NaN, ±Infinity, negative or not a number.
 * @returns nothing.
 * @example
 * assertValidTime(3, 0, 'kaplanMeier'); // ok
 * assertValidTime(-1, 4, 'kaplanMeier'); // throws RangeError
 */
export function assertValidTime(time: unknown, index: number, caller: string): asserts time is number {
  if (typeof time !== 'number' || !Number.isFinite(time) || time < 0) {
    throw new RangeError(`${caller}: obs[${index}].time must be a finite number >= 0, got ${String(time)}`);
  }
}
