import type { Assessment } from './types';

/**
 * Assessment guard.
 *
 * Checks one assessment: `weeks` finite and >= 0, `value` finite.
 *
 * Cost: O(1).
 *
 * @param a - the assessment.
 * @param where - location for the error message, e.g. `episodes[3].series[1]`.
 * @throws RangeError when `weeks` or `value` is invalid.
 * @returns nothing.
 * @example
 * assertAssessment({ weeks: 12, value: 3 }, 'series[0]'); // ok
 */
export function assertAssessment(a: Assessment, where: string): void {
  if (typeof a.weeks !== 'number' || !Number.isFinite(a.weeks) || a.weeks < 0) {
    throw new RangeError(`${where}.weeks must be a finite number >= 0, got ${String(a.weeks)}`);
  }
  if (typeof a.value !== 'number' || !Number.isFinite(a.value)) {
    throw new RangeError(`${where}.value must be a finite number, got ${String(a.value)}`);
  }
}
