import { describe, it, expect } from 'vitest';
import { mantelHaenszelRiskRatio, katzRiskRatio, twoProportionTest } from '../../analysis/index';
import type { RiskStratum } from '../../analysis/index';
import ref from '../fixtures/stats/mantel-haenszel.json';
import { expectClose } from './helpers/close';

const strata: readonly RiskStratum[] = Object.freeze(
  ref.strata.map((s) =>
    Object.freeze({
      exposedEvents: s.tolbutamide_deaths,
      exposedTotal: s.tolbutamide_total,
      unexposedEvents: s.placebo_deaths,
      unexposedTotal: s.placebo_total,
    }),
  ),
);

describe('mantelHaenszelRiskRatio: UGDP tolbutamide data (Rothman 2012, Table 10-3), Greenland-Robins 1985 CI', () => {
  it('RR_MH 1.325555, 95% CI 0.797907-2.202132', () => {
    const r = mantelHaenszelRiskRatio(strata);
    expectClose(r.riskRatio, ref.results.RR_MH);
    expectClose(r.lower, ref.results.ci95[0] ?? null);
    expectClose(r.upper, ref.results.ci95[1] ?? null);
  });
  it('90% CI 0.865753-2.029559', () => {
    const r = mantelHaenszelRiskRatio(strata, 0.9);
    expectClose(r.lower, ref.results.ci90[0] ?? null);
    expectClose(r.upper, ref.results.ci90[1] ?? null);
  });
  it('one stratum reduces to that stratum risk ratio (Rothman: 1.8113 for age < 55)', () => {
    expectClose(mantelHaenszelRiskRatio([strata[0] as RiskStratum]).riskRatio, ref.results.stratum_RR[0] ?? null);
  });
  it('strata with an empty arm contribute nothing', () => {
    const withEmpty = [...strata, { exposedEvents: 3, exposedTotal: 5, unexposedEvents: 0, unexposedTotal: 0 }];
    expect(mantelHaenszelRiskRatio(withEmpty)).toEqual(mantelHaenszelRiskRatio(strata));
  });
  it('throws RangeError: no strata, events > total, non-integer, zero pooled numerator, bad confLevel', () => {
    expect(() => mantelHaenszelRiskRatio([])).toThrow(RangeError);
    expect(() =>
      mantelHaenszelRiskRatio([{ exposedEvents: 6, exposedTotal: 5, unexposedEvents: 1, unexposedTotal: 5 }]),
    ).toThrow(RangeError);
    expect(() =>
      mantelHaenszelRiskRatio([{ exposedEvents: 1.5, exposedTotal: 5, unexposedEvents: 1, unexposedTotal: 5 }]),
    ).toThrow(RangeError);
    expect(() =>
      mantelHaenszelRiskRatio([{ exposedEvents: 0, exposedTotal: 5, unexposedEvents: 1, unexposedTotal: 5 }]),
    ).toThrow(RangeError);
    expect(() => mantelHaenszelRiskRatio(strata, 0)).toThrow(RangeError);
  });
});

describe('katzRiskRatio: crude UGDP table 30/204 vs 21/205 (scipy relative_risk, computed for this project)', () => {
  const c = ref.crude_comparison;
  it('RR 1.435574 with 95% and 90% Katz log CIs', () => {
    const r95 = katzRiskRatio(30, 204, 21, 205);
    expectClose(r95.riskRatio, c.rr);
    expectClose(r95.riskRatio, ref.results.crude_RR);
    expectClose(r95.lower, c.rr_ci95[0] ?? null);
    expectClose(r95.upper, c.rr_ci95[1] ?? null);
    const r90 = katzRiskRatio(30, 204, 21, 205, 0.9);
    expectClose(r90.lower, c.rr_ci90[0] ?? null);
    expectClose(r90.upper, c.rr_ci90[1] ?? null);
  });
  it('throws RangeError when a responder count is 0 or counts are invalid', () => {
    expect(() => katzRiskRatio(0, 10, 3, 10)).toThrow(RangeError);
    expect(() => katzRiskRatio(3, 10, 0, 10)).toThrow(RangeError);
    expect(() => katzRiskRatio(11, 10, 3, 10)).toThrow(RangeError);
    expect(() => katzRiskRatio(1, 0, 3, 10)).toThrow(RangeError);
  });
});

describe('twoProportionTest: crude UGDP table (scipy chi2_contingency, correction=False)', () => {
  it('chi-square 1.865131, p 0.172034', () => {
    const t = twoProportionTest(30, 204, 21, 205);
    expectClose(t.chiSquare, ref.crude_comparison.chisq);
    expectClose(t.pValue, ref.crude_comparison.p);
    expect(t.z).toBeGreaterThan(0);
  });
  it('all or none with the outcome: z 0, p 1', () => {
    expect(twoProportionTest(0, 10, 0, 12)).toEqual({ z: 0, chiSquare: 0, pValue: 1 });
    expect(twoProportionTest(10, 10, 12, 12)).toEqual({ z: 0, chiSquare: 0, pValue: 1 });
  });
  it('throws RangeError for invalid counts', () => {
    expect(() => twoProportionTest(3, 2, 1, 4)).toThrow(RangeError);
    expect(() => twoProportionTest(1, 0, 1, 4)).toThrow(RangeError);
  });
});
