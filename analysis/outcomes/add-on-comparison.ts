import type { RiskStratum } from '../types';
import type { AddOnComparison, AddOnEpisode } from './types';
import { newcombeDifference } from '../newcombe-difference';
import { katzRiskRatio } from '../katz-risk-ratio';
import { mantelHaenszelRiskRatio } from '../mantel-haenszel-risk-ratio';
import { twoProportionTest } from '../two-proportion-test';

/**
 * Responders with versus without one add-on.
 *
 * Among episodes with a known responder status: counts per arm; if both arms
 * have at least `minArm` episodes, the risk difference (with − without) with
 * the Newcombe hybrid score CI (method 10, 1998), the crude risk ratio with
 * the Katz log CI (null when an arm has no responders), the Mantel-Haenszel
 * risk ratio over the episodes' strata with the Greenland-Robins CI (null
 * when not estimable), and the two-sided p of the two-proportion z test
 * (Pearson χ², no continuity correction). Otherwise every estimate is null
 * and `suppressed` is true. `pAdjusted` is left null: the caller adjusts
 * across add-ons (see `addOnAssociations`). Observational associations only:
 * not evidence that an add-on works.
 *
 * Cost: O(n) for n episodes.
 *
 * @param episodes - episodes; those with `responder === null` are skipped. Not modified.
 * @param addOn - the add-on code.
 * @param opts - `minArm` integer >= 1; `confLevel` in (0, 1).
 * @throws RangeError when `confLevel` is outside (0, 1).
 * @returns the comparison.
 * @example
 * compareAddOn(episodes, 'taping', { minArm: 10, confLevel: 0.95 }).riskDifference;
 */
export function compareAddOn(
  episodes: readonly AddOnEpisode[],
  addOn: string,
  opts: { minArm: number; confLevel: number },
): AddOnComparison {
  const strata = new Map<string, RiskStratum>();
  let withN = 0;
  let withR = 0;
  let withoutN = 0;
  let withoutR = 0;
  let mhMissingStratum = 0;
  for (const e of episodes) {
    if (e.responder === null) continue;
    const exposed = e.addOns.includes(addOn);
    const hit = e.responder ? 1 : 0;
    if (exposed) {
      withN++;
      withR += hit;
    } else {
      withoutN++;
      withoutR += hit;
    }
    if (e.stratum === null) {
      mhMissingStratum++;
      continue;
    }
    // One mutable counter per stratum: copying it per episode cost ~30% of the endpoint at 10⁵ episodes.
    let s = strata.get(e.stratum);
    if (s === undefined) {
      s = { exposedEvents: 0, exposedTotal: 0, unexposedEvents: 0, unexposedTotal: 0 };
      strata.set(e.stratum, s);
    }
    if (exposed) {
      s.exposedEvents += hit;
      s.exposedTotal++;
    } else {
      s.unexposedEvents += hit;
      s.unexposedTotal++;
    }
  }
  const informative = [...strata.values()].filter((s) => s.exposedTotal > 0 && s.unexposedTotal > 0);
  const base = {
    addOn,
    withAddOn: { n: withN, responders: withR, nonResponders: withN - withR },
    withoutAddOn: { n: withoutN, responders: withoutR, nonResponders: withoutN - withoutR },
    mhStrata: informative.length,
    mhMissingStratum,
    pAdjusted: null,
  };
  if (withN < opts.minArm || withoutN < opts.minArm) {
    return { ...base, suppressed: true, riskDifference: null, riskRatio: null, mhRiskRatio: null, pValue: null };
  }
  const attempt = <T>(f: () => T): T | null => {
    try {
      return f();
    } catch (err) {
      if (err instanceof RangeError) return null;
      throw err;
    }
  };
  return {
    ...base,
    suppressed: false,
    riskDifference: newcombeDifference(withR, withN, withoutR, withoutN, opts.confLevel),
    riskRatio: attempt(() => katzRiskRatio(withR, withN, withoutR, withoutN, opts.confLevel)),
    mhRiskRatio: informative.length > 0 ? attempt(() => mantelHaenszelRiskRatio(informative, opts.confLevel)) : null,
    pValue: twoProportionTest(withR, withN, withoutR, withoutN).pValue,
  };
}
