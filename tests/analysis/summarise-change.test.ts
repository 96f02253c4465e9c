import { describe, it, expect } from 'vitest';
import { quantileSorted } from 'simple-statistics';
import { summariseChange } from '../../analysis/index';
import ref from '../fixtures/stats/effect-sizes.json';
import { expectClose } from './helpers/close';

const sleep = Object.freeze(
  ref.sleep.drug1.map((baseline, i) => Object.freeze({ baseline, followUp: ref.sleep.drug2[i] ?? NaN })),
);

describe('summariseChange: Student 1908 sleep data (drug 1 as baseline, drug 2 as follow-up)', () => {
  const s = summariseChange(sleep, { higherIsBetter: true });
  it('mean change 1.58 with the paired t 95% CI 0.700114-2.459886 (R t.test / scipy)', () => {
    expect(s.n).toBe(10);
    expectClose(s.meanChange, ref.sleep.mean_change);
    expectClose(s.meanChangeCi?.lower, ref.sleep.ci95_mean_change[0] ?? null);
    expectClose(s.meanChangeCi?.upper, ref.sleep.ci95_mean_change[1] ?? null);
    expectClose(s.sdChange, ref.sleep.sd_change);
  });
  it('SRM 1.284558 (Liang et al. 1990) and ES 0.883170 (Kazis et al. 1989)', () => {
    expectClose(s.srm, ref.sleep.srm);
    expectClose(s.sdBaseline, ref.sleep.sd_baseline);
    expectClose(s.effectSize, ref.sleep.es);
  });
  it('median and quartiles by R type 7 (R 4.2.2 quantile: 1.05 / 1.3 / 1.7)', () => {
    expectClose(s.q1, ref.sleep.quartiles_type7.q1, 1e-12);
    expectClose(s.median, ref.sleep.quartiles_type7.median, 1e-12);
    expectClose(s.q3, ref.sleep.quartiles_type7.q3, 1e-12);
  });
  it('lower-is-better scores: negating both scores with higherIsBetter false gives the same summary', () => {
    const flipped = sleep.map((p) => ({ baseline: -p.baseline, followUp: -p.followUp }));
    const f = summariseChange(flipped, { higherIsBetter: false });
    expectClose(f.meanChange, s.meanChange, 1e-12);
    expectClose(f.srm, s.srm, 1e-12);
  });
  it('a 90% CI is narrower', () => {
    const n90 = summariseChange(sleep, { higherIsBetter: true, confLevel: 0.9 });
    expect(n90.meanChangeCi?.lower ?? 0).toBeGreaterThan(s.meanChangeCi?.lower ?? 0);
  });
});

describe('summariseChange: Lakens 2013 movie ratings, d_z = SRM = 1.5', () => {
  it('movie 1 minus movie 2: mean 1, SD 0.666667, SRM 1.5', () => {
    const pairs = ref.lakens.movie2.map((baseline, i) => ({ baseline, followUp: ref.lakens.movie1[i] ?? NaN }));
    const s = summariseChange(pairs, { higherIsBetter: true });
    expectClose(s.meanChange, ref.lakens.mean_diff);
    expectClose(s.sdChange, ref.lakens.sd_diff);
    expectClose(s.srm, ref.lakens.d_z);
  });
});

describe('quantile convention: simple-statistics 7.12 quantileSorted is R type 7', () => {
  it('R 4.2.2 quantile(c(7,1,3,10,4,8), type = 7) = 3.25 / 5.5 / 7.75 (type 6 would give 2.5 / 8.5)', () => {
    const x = [...ref.quantile_type7_small.x].sort((a, b) => a - b);
    expect(quantileSorted(x, 0.25)).toBeCloseTo(ref.quantile_type7_small.q1, 12);
    expect(quantileSorted(x, 0.5)).toBeCloseTo(ref.quantile_type7_small.median, 12);
    expect(quantileSorted(x, 0.75)).toBeCloseTo(ref.quantile_type7_small.q3, 12);
  });
});

describe('summariseChange: edge cases', () => {
  it('n = 1: mean and median only; SD-based values null', () => {
    const s = summariseChange([{ baseline: 7, followUp: 2 }], { higherIsBetter: false });
    expect(s).toMatchObject({
      n: 1,
      meanChange: 5,
      median: 5,
      q1: 5,
      q3: 5,
      meanChangeCi: null,
      sdChange: null,
      srm: null,
    });
  });
  it('zero SD of change gives null SRM; zero SD at baseline gives null ES', () => {
    const s = summariseChange(
      [
        { baseline: 6, followUp: 4 },
        { baseline: 6, followUp: 4 },
      ],
      { higherIsBetter: false },
    );
    expect(s.srm).toBeNull();
    expect(s.effectSize).toBeNull();
    expect(s.meanChangeCi).toEqual({ lower: 2, upper: 2 });
  });
  it('throws RangeError on empty input, non-finite scores or bad confLevel', () => {
    expect(() => summariseChange([], { higherIsBetter: true })).toThrow(RangeError);
    expect(() => summariseChange([{ baseline: NaN, followUp: 1 }], { higherIsBetter: true })).toThrow(RangeError);
    expect(() => summariseChange(sleep, { higherIsBetter: true, confLevel: 1 })).toThrow(RangeError);
  });
});
