import type { AddOnEpisode, AddOnReport } from './types';
import { compareAddOn } from './add-on-comparison';
import { benjaminiHochberg } from '../benjamini-hochberg';
import { assertConfLevel } from '../assert-conf-level';

/**
 * Add-on association report.
 *
 * For every add-on (default: every code recorded, sorted) compares the
 * responder share with and without it (`compareAddOn`: Newcombe risk
 * difference, Katz crude risk ratio, Mantel-Haenszel risk ratio over the
 * given strata, two-proportion z-test p) and adjusts the p-values across the
 * add-ons that have one with Benjamini-Hochberg (1995). Comparisons where an
 * arm has fewer than `minArm` episodes (default 10) are suppressed (null
 * estimates) and take no part in the adjustment. Episodes with a missing
 * responder status are counted and excluded. These are observational
 * associations, not treatment effects.
 *
 * Cost: O(n·a + a log a) for n episodes and a add-ons.
 *
 * @param episodes - episodes with responder status, add-on codes and stratum. Not modified.
 * @param opts - `addOns` to report; `minArm` integer >= 1 (default 10); `confLevel` in (0, 1) (default 0.95).
 * @throws RangeError when `minArm` is not a positive integer or `confLevel` is outside (0, 1).
 * @returns counts and one comparison per add-on.
 * @example
 * addOnAssociations(episodes).comparisons.map((c) => [c.addOn, c.pAdjusted]);
 */
export function addOnAssociations(
  episodes: readonly AddOnEpisode[],
  opts: { addOns?: readonly string[]; minArm?: number; confLevel?: number } = {},
): AddOnReport {
  const minArm = opts.minArm ?? 10;
  const confLevel = opts.confLevel ?? 0.95;
  if (!Number.isInteger(minArm) || minArm < 1) {
    throw new RangeError(`addOnAssociations: minArm must be an integer >= 1, got ${minArm}`);
  }
  assertConfLevel(confLevel);
  const codes =
    opts.addOns !== undefined
      ? [...new Set(opts.addOns)]
      : [...new Set(episodes.flatMap((e) => e.addOns))].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  const comparisons = codes.map((code) => compareAddOn(episodes, code, { minArm, confLevel }));
  const tested = comparisons.filter((c) => c.pValue !== null);
  const adjusted = benjaminiHochberg(tested.map((c) => c.pValue ?? 1));
  const adjustedByCode = new Map(tested.map((c, i) => [c.addOn, adjusted[i] ?? null]));
  let nMissingOutcome = 0;
  for (const e of episodes) if (e.responder === null) nMissingOutcome++;
  return {
    nEpisodes: episodes.length,
    nMissingOutcome,
    comparisons: comparisons.map((c) => ({ ...c, pAdjusted: adjustedByCode.get(c.addOn) ?? null })),
  };
}
