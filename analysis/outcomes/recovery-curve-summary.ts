import type { ConfType, Obs } from '../types';
import type { RecoveryCurveSummary } from './types';
import { kaplanMeier } from '../kaplan-meier';
import { recoveredShareAt } from './recovered-share-at';

/**
 * Time-to-recovery summary of one group.
 *
 * Fits Kaplan-Meier to recovery observations and reports the counts, the
 * cumulative share recovered (1 − S, bounds flipped, see `recoveredShareAt`)
 * at each requested week, and the median weeks to recovery with its CI
 * (Kaplan-Meier median rule, see `kaplanMeier`).
 *
 * Cost: O(n log n + w log n) for n observations and w weeks.
 *
 * @param obs - recovery observations (at least one). Not modified.
 * @param opts - `weeks` (each finite >= 0); `confLevel` in (0, 1), default
 *   0.95; `confType`, default `'log-log'`.
 * @throws RangeError as `kaplanMeier` and `recoveredShareAt` do.
 * @returns the group summary.
 * @example
 * summariseRecoveryCurve(obs, { weeks: [6, 12, 26] }).atWeeks[1].estimate; // share recovered by week 12
 */
export function summariseRecoveryCurve(
  obs: readonly Obs[],
  opts: { weeks: readonly number[]; confLevel?: number; confType?: ConfType },
): RecoveryCurveSummary {
  const km = kaplanMeier(obs, {
    confLevel: opts.confLevel ?? 0.95,
    confType: opts.confType ?? 'log-log',
  });
  let recovered = 0;
  for (const o of obs) if (o.event) recovered++;
  return {
    n: obs.length,
    recovered,
    censored: obs.length - recovered,
    atWeeks: opts.weeks.map((w) => recoveredShareAt(km, w)),
    medianWeeks: km.median,
  };
}
