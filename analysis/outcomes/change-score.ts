/**
 * Sign-corrected change score.
 *
 * Follow-up minus baseline for instruments where a higher score is better
 * (e.g. LEFS, PSFS), baseline minus follow-up where a lower score is better
 * (e.g. NPRS pain), so a positive change always means improvement
 * (common practice, no published source).
 *
 * Cost: O(1).
 *
 * @param baseline - score at the start, finite.
 * @param followUp - score at follow-up, finite.
 * @param higherIsBetter - direction of the instrument.
 * @throws RangeError when a score is not finite.
 * @returns the change, positive = better.
 * @example
 * changeScore(7, 3, false); // 4 (pain fell from 7 to 3)
 * changeScore(40, 52, true); // 12
 */
export function changeScore(baseline: number, followUp: number, higherIsBetter: boolean): number {
  if (!Number.isFinite(baseline) || !Number.isFinite(followUp)) {
    throw new RangeError('changeScore: baseline and followUp must be finite numbers');
  }
  return higherIsBetter ? followUp - baseline : baseline - followUp;
}
