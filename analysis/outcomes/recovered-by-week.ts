import type { Obs } from '../types';

/**
 * Recovered by a given week, from one observation.
 *
 * true when the episode recovered at or before `weeks`; false when it was
 * still followed at `weeks` without having recovered (event later, or
 * censored at or after `weeks`); null when it was censored before `weeks`,
 * so the status is unknown. Gives the binomial count for the clinic funnel
 * plot of "recovered by 12 weeks" (common practice, no published source).
 *
 * Cost: O(1).
 *
 * @param obs - the episode's recovery observation.
 * @param weeks - the time point, finite and >= 0.
 * @throws RangeError when `weeks` is negative or not finite.
 * @returns true, false or null.
 * @example
 * recoveredByWeek({ time: 8, event: true }, 12);   // true
 * recoveredByWeek({ time: 6, event: false }, 12);  // null
 */
export function recoveredByWeek(obs: Obs, weeks: number): boolean | null {
  if (!Number.isFinite(weeks) || weeks < 0)
    throw new RangeError(`recoveredByWeek: weeks must be finite and >= 0, got ${weeks}`);
  if (obs.event && obs.time <= weeks) return true;
  if (obs.time >= weeks) return false;
  return null;
}
