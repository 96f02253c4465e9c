import type { RiskRatioInterval, RiskStratum } from './types';
import { twoSidedZ } from './two-sided-z';
import { assertCount } from './assert-count';

/**
 * Mantel-Haenszel pooled risk ratio.
 *
 * Pools the risk ratio over strata (Mantel & Haenszel 1959; Rothman,
 * Epidemiology: An Introduction, 2nd ed. 2012, ch. 10):
 * RR = Σ(aᵢ·n0ᵢ/nᵢ) / Σ(cᵢ·n1ᵢ/nᵢ), with a = exposed events, n1 = exposed
 * total, c = unexposed events, n0 = unexposed total, n = n1 + n0. The CI is
 * exp(ln RR ∓ z·SE) with the Greenland & Robins (1985) variance
 * Var(ln RR) = Σ((m1ᵢ·n1ᵢ·n0ᵢ − aᵢ·cᵢ·nᵢ)/nᵢ²) / (Σ aᵢn0ᵢ/nᵢ · Σ cᵢn1ᵢ/nᵢ),
 * m1 = a + c; this is R `epiR::epi.2by2` "RR.mh.wald". Strata with nobody in
 * one arm contribute nothing and are allowed.
 *
 * Cost: O(s) for s strata.
 *
 * @param strata - 2×2 tables; counts are integers, events <= totals. Not modified.
 * @param confLevel - in (0, 1), default 0.95.
 * @throws RangeError when there are no strata, a count is invalid, an event
 *   count exceeds its total, `confLevel` is outside (0, 1), or either pooled
 *   sum is 0 (the ratio would be 0 or infinite and the log-scale CI undefined).
 * @returns the pooled risk ratio and its limits.
 * @example
 * mantelHaenszelRiskRatio([
 *   { exposedEvents: 8, exposedTotal: 106, unexposedEvents: 5, unexposedTotal: 120 },
 *   { exposedEvents: 22, exposedTotal: 98, unexposedEvents: 16, unexposedTotal: 85 },
 * ]); // { riskRatio: 1.325555, lower: 0.797907, upper: 2.202132 }
 */
export function mantelHaenszelRiskRatio(strata: readonly RiskStratum[], confLevel = 0.95): RiskRatioInterval {
  if (strata.length === 0) throw new RangeError('mantelHaenszelRiskRatio: at least one stratum is required');
  const z = twoSidedZ(confLevel);
  let num = 0;
  let den = 0;
  let varNum = 0;
  strata.forEach((s, i) => {
    const where = `mantelHaenszelRiskRatio: strata[${i}]`;
    assertCount(s.exposedEvents, `${where}.exposedEvents`);
    assertCount(s.exposedTotal, `${where}.exposedTotal`);
    assertCount(s.unexposedEvents, `${where}.unexposedEvents`);
    assertCount(s.unexposedTotal, `${where}.unexposedTotal`);
    if (s.exposedEvents > s.exposedTotal || s.unexposedEvents > s.unexposedTotal) {
      throw new RangeError(`${where}: events must not exceed totals`);
    }
    const a = s.exposedEvents;
    const c = s.unexposedEvents;
    const n1 = s.exposedTotal;
    const n0 = s.unexposedTotal;
    const n = n1 + n0;
    if (n === 0) return;
    num += (a * n0) / n;
    den += (c * n1) / n;
    varNum += ((a + c) * n1 * n0 - a * c * n) / (n * n);
  });
  if (num === 0 || den === 0) {
    throw new RangeError(
      'mantelHaenszelRiskRatio: the pooled ratio is 0 or infinite (no events in one arm); no log-scale CI',
    );
  }
  const riskRatio = num / den;
  const se = Math.sqrt(varNum / (num * den));
  return { riskRatio, lower: riskRatio * Math.exp(-z * se), upper: riskRatio * Math.exp(z * se) };
}
