import type { KaplanMeierResult } from '../types';
import type { RecoveredShare } from './types';

/**
 * Cumulative share recovered by a given week.
 *
 * Reads 1 − S(t) off a Kaplan-Meier table, where S is the share not yet
 * recovered and the table is a right-continuous step function (S(t) is the
 * value of the last step at or before t; before the first step the share is
 * 0 with null bounds). The
 * confidence bounds flip: lower = 1 − upper(S), upper = 1 − lower(S); a
 * bound is null where the KM bound is undefined. Beyond the last observed
 * time the estimate is null unless the curve has already reached 0 (then
 * everybody has recovered and the share is 1 for all later weeks).
 *
 * Cost: O(log m) for m steps (binary search).
 *
 * @param km - result of `kaplanMeier` on recovery observations.
 * @param weeks - time point, finite and >= 0.
 * @throws RangeError when `weeks` is negative or not finite.
 * @returns the share recovered with its bounds.
 * @example
 * // 6-MP arm of Freireich et al. 1963 read as 'recovery' times, log-log CI:
 * recoveredShareAt(kaplanMeier(sixMp), 12); // { weeks: 12, estimate: 0.247059, lower: 0.110638, upper: 0.496800 }
 */
export function recoveredShareAt(km: KaplanMeierResult, weeks: number): RecoveredShare {
  if (!Number.isFinite(weeks) || weeks < 0)
    throw new RangeError(`recoveredShareAt: weeks must be finite and >= 0, got ${weeks}`);
  const steps = km.steps;
  let lo = 0;
  let hi = steps.length; // first index with time > weeks
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((steps[mid]?.time ?? Infinity) <= weeks) lo = mid + 1;
    else hi = mid;
  }
  if (lo === 0) return { weeks, estimate: 0, lower: null, upper: null };
  const step = steps[lo - 1];
  const lastStep = steps[steps.length - 1];
  if (step === undefined || lastStep === undefined) return { weeks, estimate: null, lower: null, upper: null };
  if (weeks > lastStep.time && lastStep.survival > 0) return { weeks, estimate: null, lower: null, upper: null };
  return {
    weeks,
    estimate: 1 - step.survival,
    lower: step.upper === null ? null : 1 - step.upper,
    upper: step.lower === null ? null : 1 - step.lower,
  };
}
