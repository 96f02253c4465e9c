import { describe, it, expect } from 'vitest';
import { logRank } from '../../analysis/index';
import type { GroupedObs } from '../../analysis/index';
import freireichLr from '../fixtures/stats/logrank-freireich.json';
import multi from '../fixtures/stats/logrank-multigroup.json';
import bewick from '../fixtures/stats/kaplan-meier-bewick.json';
import { expectClose } from './helpers/close';
import { sixMp, placebo, tag } from './helpers/freireich';

const twoArms: readonly GroupedObs[] = Object.freeze(
  [...tag(sixMp, '6-MP'), ...tag(placebo, 'placebo')].map((o) => Object.freeze(o)),
);
const bewickObs = bewick.data.time.map((time, i) => ({ time, event: bewick.data.status[i] === 1 }));
const threeGroups: readonly GroupedObs[] = [...twoArms, ...tag(bewickObs, 'bewick')];

describe('logRank: Freireich et al. 1963 6-MP vs placebo (R survdiff / scipy values)', () => {
  const r = freireichLr.results;
  it('chi-square 16.792941, 1 df, p 4.168809e-05', () => {
    const res = logRank(twoArms);
    expectClose(res.chiSquare, r.chisq);
    expect(res.df).toBe(1);
    expect(Math.abs(res.pValue - r.p) / r.p).toBeLessThan(1e-6);
  });
  it('observed 9 / 21, expected 19.250501 / 10.749499; groups sorted by label', () => {
    const res = logRank(twoArms);
    expect(res.groups.map((g) => [g.group, g.n, g.observed])).toEqual([
      ['6-MP', 21, r.O1],
      ['placebo', 21, r.O2],
    ]);
    expectClose(res.groups[0]?.expected, r.E1);
    expectClose(res.groups[1]?.expected, r.E2);
  });
  it('is the hypergeometric-variance statistic, not the shortcut sum (O-E)^2/E = 15.2329', () => {
    expect(Math.abs(logRank(twoArms).chiSquare - r.sum_OE2_over_E_chisq)).toBeGreaterThan(1);
  });
  it('k = 2 reduction: chi-square equals z^2 with scipy z = -4.097919', () => {
    expectClose(logRank(twoArms).chiSquare, r.z * r.z);
  });
  it('does not modify frozen input', () => {
    expect(() => logRank(twoArms)).not.toThrow();
  });
});

describe('logRank: k > 2 groups against R survival 3.5.3 survdiff (computed for this project)', () => {
  it('three groups (Freireich arms + Bewick 2004 times): chi-square 17.627902 on 2 df', () => {
    const ref = multi.three_groups;
    const res = logRank(threeGroups);
    expect(res.groups.map((g) => g.group)).toEqual(ref.groups);
    expect(res.groups.map((g) => g.n)).toEqual(ref.n);
    expect(res.groups.map((g) => g.observed)).toEqual(ref.observed);
    res.groups.forEach((g, i) => expectClose(g.expected, ref.expected[i] ?? null));
    expectClose(res.chiSquare, ref.chisq);
    expect(res.df).toBe(2);
    expect(Math.abs(res.pValue - ref.p) / ref.p).toBeLessThan(1e-6);
  });
  it('four groups (each Freireich arm split by odd/even position): chi-square 17.167295 on 3 df', () => {
    const ref = multi.four_groups;
    const obs: GroupedObs[] = [
      ...sixMp.map((o, i) => ({ ...o, group: i % 2 === 0 ? '6-MP-odd' : '6-MP-even' })),
      ...placebo.map((o, i) => ({ ...o, group: i % 2 === 0 ? 'placebo-odd' : 'placebo-even' })),
    ];
    const res = logRank(obs);
    expect(res.groups.map((g) => g.group)).toEqual(ref.groups);
    expect(res.groups.map((g) => g.observed)).toEqual(ref.observed);
    res.groups.forEach((g, i) => expectClose(g.expected, ref.expected[i] ?? null));
    expectClose(res.chiSquare, ref.chisq);
    expect(res.df).toBe(3);
    expect(Math.abs(res.pValue - ref.p) / ref.p).toBeLessThan(1e-6);
  });
  it('a group with nobody at risk at any event time drops out (df 2, same chi-square), as in R', () => {
    const early = [0.5, 0.5, 0.5].map((time) => ({ time, event: false, group: 'early' }));
    const res = logRank([...threeGroups, ...early]);
    expect(res.df).toBe(multi.degenerate_group.df);
    expectClose(res.chiSquare, multi.degenerate_group.chisq);
    expect(res.groups.find((g) => g.group === 'early')).toEqual({ group: 'early', n: 3, observed: 0, expected: 0 });
  });
  it('the same holds when the degenerate group sorts last (it is the group left out of u)', () => {
    const late = [0.5, 0.5, 0.5].map((time) => ({ time, event: false, group: 'zzz' }));
    const res = logRank([...threeGroups, ...late]);
    expect(res.df).toBe(2);
    expectClose(res.chiSquare, multi.degenerate_group.chisq);
  });
  it('observed and expected totals agree (Σ O = Σ E)', () => {
    const res = logRank(threeGroups);
    const sum = (f: (g: (typeof res.groups)[number]) => number) => res.groups.reduce((s, g) => s + f(g), 0);
    expectClose(
      sum((g) => g.expected),
      sum((g) => g.observed),
      1e-9,
    );
  });
});

describe('logRank: invariances', () => {
  it('renaming labels and reordering rows leave chi-square unchanged', () => {
    const base = logRank(threeGroups);
    const renamed = threeGroups.map((o) => ({
      ...o,
      group: { '6-MP': 'z', placebo: 'a', bewick: 'm' }[o.group] ?? '',
    }));
    const reversed = [...renamed].reverse();
    for (const variant of [renamed, reversed]) {
      const res = logRank(variant);
      expectClose(res.chiSquare, base.chiSquare, 1e-10);
      expect(res.df).toBe(base.df);
    }
  });
});

describe('logRank: edge cases', () => {
  it('throws RangeError on empty input', () => {
    expect(() => logRank([])).toThrow(RangeError);
  });
  it('throws RangeError with a single group', () => {
    expect(() => logRank(tag(sixMp, 'only'))).toThrow(RangeError);
  });
  it('throws RangeError with no events at all', () => {
    expect(() =>
      logRank([
        { time: 1, event: false, group: 'a' },
        { time: 2, event: false, group: 'b' },
      ]),
    ).toThrow(RangeError);
  });
  it('throws RangeError when no event time has two groups at risk (df would be 0)', () => {
    expect(() =>
      logRank([
        { time: 0.5, event: false, group: 'b' },
        { time: 1, event: true, group: 'a' },
        { time: 2, event: true, group: 'a' },
      ]),
    ).toThrow(RangeError);
  });
  it('throws RangeError for invalid times, events or labels', () => {
    expect(() => logRank([{ time: -1, event: true, group: 'a' }])).toThrow(RangeError);
    expect(() => logRank([{ time: NaN, event: true, group: 'a' }])).toThrow(RangeError);
    expect(() => logRank([{ time: 1, event: null as unknown as boolean, group: 'a' }])).toThrow(RangeError);
    expect(() => logRank([{ time: 1, event: true, group: 3 as unknown as string }])).toThrow(RangeError);
  });
});
