import type { Obs } from '../types';
import type { Assessment, RecoveryRule } from './types';
import { assertAssessment } from './assert-assessment';
import { DEFAULT_RECOVERY_RULE } from './default-recovery-rule';

/**
 * Time-to-recovery observation of one episode.
 *
 * Turns an assessment series into a right-censored observation for
 * Kaplan-Meier: an event at the first assessment after the start that meets
 * the recovery rule (time = its weeks), otherwise censored at the last
 * assessment (the usual construction for interval-observed data, taking the
 * visit at which recovery was first seen as the event time; common practice,
 * no published source). The baseline at week 0 never counts as recovery; an
 * episode assessed only at baseline is censored at 0. The series may be in
 * any order.
 *
 * Cost: O(a) for a assessments.
 *
 * @param series - assessments; `weeks` finite >= 0, `value` finite. Not modified.
 * @param rule - recovery rule, default {@link DEFAULT_RECOVERY_RULE} (NPRS <= 2).
 * @throws RangeError when an assessment or the rule's threshold is invalid.
 * @returns the observation, or null when the series is empty.
 * @example
 * recoveryObservation([{ weeks: 0, value: 7 }, { weeks: 6, value: 4 }, { weeks: 12, value: 2 }]);
 * // { time: 12, event: true }
 */
export function recoveryObservation(
  series: readonly Assessment[],
  rule: RecoveryRule = DEFAULT_RECOVERY_RULE,
): Obs | null {
  if (!Number.isFinite(rule.threshold)) throw new RangeError('recoveryObservation: rule.threshold must be finite');
  if (rule.direction !== 'atMost' && rule.direction !== 'atLeast') {
    throw new RangeError(`recoveryObservation: rule.direction must be 'atMost' or 'atLeast'`);
  }
  if (series.length === 0) return null;
  let firstRecovery = Infinity;
  let last = -Infinity;
  for (let i = 0; i < series.length; i++) {
    const a = series[i];
    if (a === undefined) continue;
    assertAssessment(a, `recoveryObservation: series[${i}]`);
    if (a.weeks > last) last = a.weeks;
    const meets = rule.direction === 'atMost' ? a.value <= rule.threshold : a.value >= rule.threshold;
    if (meets && a.weeks > 0 && a.weeks < firstRecovery) firstRecovery = a.weeks;
  }
  return firstRecovery < Infinity ? { time: firstRecovery, event: true } : { time: last, event: false };
}
