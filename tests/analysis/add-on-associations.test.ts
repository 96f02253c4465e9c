import { describe, it, expect } from 'vitest';
import {
  addOnAssociations,
  compareAddOn,
  benjaminiHochberg,
  newcombeDifference,
  stratumKey,
} from '../../analysis/index';
import type { AddOnEpisode } from '../../analysis/index';
import mh from '../fixtures/stats/mantel-haenszel.json';
import wn from '../fixtures/stats/wilson-newcombe.json';
import { expectClose } from './helpers/close';

function arm(n: number, events: number, addOns: string[], stratum: string | null): AddOnEpisode[] {
  return Array.from({ length: n }, (_, i) => ({ responder: i < events, addOns, stratum }));
}

// The UGDP strata (Rothman 2012, Table 10-3) recast as episodes: "tolb" is the add-on, the outcome
// counts stand in for responders purely to check the arithmetic against the published table.
const ugdp: AddOnEpisode[] = mh.strata.flatMap((s) => [
  ...arm(s.tolbutamide_total, s.tolbutamide_deaths, ['tolb'], s.age),
  ...arm(s.placebo_total, s.placebo_deaths, [], s.age),
]);

describe('compareAddOn on the UGDP table', () => {
  const c = compareAddOn(ugdp, 'tolb', { minArm: 10, confLevel: 0.95 });
  it('counts per arm', () => {
    expect(c.withAddOn).toEqual({ n: 204, responders: 30, nonResponders: 174 });
    expect(c.withoutAddOn).toEqual({ n: 205, responders: 21, nonResponders: 184 });
    expect(c.suppressed).toBe(false);
    expect(c.mhStrata).toBe(2);
  });
  it('Mantel-Haenszel RR 1.325555 (0.797907-2.202132), Greenland & Robins 1985', () => {
    expectClose(c.mhRiskRatio?.riskRatio, mh.results.RR_MH);
    expectClose(c.mhRiskRatio?.lower, mh.results.ci95[0] ?? null);
    expectClose(c.mhRiskRatio?.upper, mh.results.ci95[1] ?? null);
  });
  it('crude RR with Katz CI and chi-square p (scipy, computed for this project)', () => {
    expectClose(c.riskRatio?.riskRatio, mh.crude_comparison.rr);
    expectClose(c.riskRatio?.lower, mh.crude_comparison.rr_ci95[0] ?? null);
    expectClose(c.riskRatio?.upper, mh.crude_comparison.rr_ci95[1] ?? null);
    expectClose(c.pValue, mh.crude_comparison.p);
  });
  it('risk difference is the Newcombe hybrid score interval', () => {
    expect(c.riskDifference).toEqual(newcombeDifference(30, 204, 21, 205));
  });
  it('episodes with an unknown stratum are counted and left out of the MH estimate only', () => {
    const extra = [...ugdp, { responder: true, addOns: ['tolb'], stratum: null }];
    const r = compareAddOn(extra, 'tolb', { minArm: 10, confLevel: 0.95 });
    expect(r.mhMissingStratum).toBe(1);
    expect(r.withAddOn.n).toBe(205);
    expectClose(r.mhRiskRatio?.riskRatio, mh.results.RR_MH);
  });
});

describe('addOnAssociations', () => {
  // Newcombe 1998 example (a): 56/70 vs 48/80, as a second add-on "heel-cup" on separate episodes
  const a = wn.difference[0];
  const cups: AddOnEpisode[] = [
    ...arm(a?.n1 ?? 0, a?.x1 ?? 0, ['heel-cup'], stratumKey('active', '<3m')),
    ...arm(a?.n2 ?? 0, a?.x2 ?? 0, [], stratumKey('active', '<3m')),
  ];
  const rare: AddOnEpisode[] = arm(6, 4, ['rare'], 'x');
  const missing: AddOnEpisode[] = [{ responder: null, addOns: ['heel-cup'], stratum: 'x' }];
  const episodes = Object.freeze([...cups, ...rare, ...missing]);
  const report = addOnAssociations(episodes);

  it('reports every add-on found, sorted, and counts missing outcomes', () => {
    expect(report.comparisons.map((c) => c.addOn)).toEqual(['heel-cup', 'rare']);
    expect(report.nEpisodes).toBe(157);
    expect(report.nMissingOutcome).toBe(1);
  });
  it('counts per arm: episodes of other add-ons sit in the without arm', () => {
    const c = report.comparisons[0];
    expect(c?.withAddOn).toEqual({ n: 70, responders: 56, nonResponders: 14 });
    expect(c?.withoutAddOn).toEqual({ n: 86, responders: 52, nonResponders: 34 }); // 80 + the 6 "rare" episodes
  });
  it('suppresses an add-on whose arm has fewer than 10 episodes (configurable)', () => {
    const rareRow = report.comparisons[1];
    expect(rareRow).toMatchObject({
      suppressed: true,
      riskDifference: null,
      riskRatio: null,
      mhRiskRatio: null,
      pValue: null,
      pAdjusted: null,
    });
    expect(rareRow?.withAddOn).toEqual({ n: 6, responders: 4, nonResponders: 2 });
    const loose = addOnAssociations(episodes, { minArm: 5 });
    expect(loose.comparisons[1]?.suppressed).toBe(false);
  });
  it('BH adjustment runs over the add-ons that have a p-value', () => {
    const both = addOnAssociations([...ugdp, ...cups]);
    const ps = both.comparisons.map((c) => c.pValue ?? NaN);
    const adj = benjaminiHochberg(ps);
    both.comparisons.forEach((c, i) => expectClose(c.pAdjusted, adj[i] ?? null, 1e-12));
    expect(both.comparisons.every((c) => (c.pAdjusted ?? 0) >= (c.pValue ?? 1))).toBe(true);
  });
  it('the Newcombe (a) interval is reproduced when the arms are exactly 56/70 and 48/80', () => {
    const c = compareAddOn(cups, 'heel-cup', { minArm: 10, confLevel: 0.95 });
    expectClose(c.riskDifference?.lower, a?.method10_score[0] ?? null);
    expectClose(c.riskDifference?.upper, a?.method10_score[1] ?? null);
  });
  it('a zero responder count gives a null crude RR, not an error', () => {
    const zero = [...arm(12, 0, ['z'], 's'), ...arm(12, 5, [], 's')];
    const c = compareAddOn(zero, 'z', { minArm: 10, confLevel: 0.95 });
    expect(c.riskRatio).toBeNull();
    expect(c.mhRiskRatio).toBeNull();
    expect(c.riskDifference).not.toBeNull();
  });
  it('throws RangeError for a bad minArm or confLevel', () => {
    expect(() => addOnAssociations(episodes, { minArm: 0 })).toThrow(RangeError);
    expect(() => addOnAssociations(episodes, { confLevel: 2 })).toThrow(RangeError);
  });
});
