import { describe, it, expect } from 'vitest';
import { funnelLimits } from '../../analysis/index';
import { binomialCdfTable } from '../../analysis/binomial-cdf-table';
import ref from '../fixtures/stats/funnel-limits.json';
import cdfRef from '../fixtures/stats/binomial-cdf.json';
import { expectClose } from './helpers/close';

describe('funnelLimits: Spiegelhalter 2005 exact binomial limits with interpolation (scipy/R values)', () => {
  for (const row of ref.limits) {
    it(`p0 = ${row.target_p0}, n = ${row.n}: 95% and 99.8%`, () => {
      const l95 = funnelLimits(row.target_p0, row.n, 0.95);
      const l998 = funnelLimits(row.target_p0, row.n, 0.998);
      expectClose(l95.lower, row.exact_95[0] ?? null);
      expectClose(l95.upper, row.exact_95[1] ?? null);
      expectClose(l998.lower, row['exact_99.8'][0] ?? null);
      expectClose(l998.upper, row['exact_99.8'][1] ?? null);
    });
  }
  it('returns raw unclamped limits (p0 = 0.1, n = 10: lower -0.092830)', () => {
    expect(funnelLimits(0.1, 10, 0.95).lower).toBeLessThan(0);
  });
  it('limits narrow as n grows', () => {
    const a = funnelLimits(0.6, 50, 0.998);
    const b = funnelLimits(0.6, 500, 0.998);
    expect(b.upper - b.lower).toBeLessThan(a.upper - a.lower);
  });
  it('throws RangeError for target outside (0, 1), bad n or coverage', () => {
    for (const args of [
      [0, 10, 0.95],
      [1, 10, 0.95],
      [0.5, 0, 0.95],
      [0.5, 2.5, 0.95],
      [0.5, 10, 1],
      [0.5, 10, 0],
      [NaN, 10, 0.95],
    ] as const) {
      expect(() => funnelLimits(args[0], args[1], args[2])).toThrow(RangeError);
    }
  });
});

describe('binomialCdfTable: against scipy.stats.binom.cdf (computed for this project)', () => {
  for (const c of cdfRef.cases) {
    it(`F(${c.r}; n = ${c.n}, p = ${c.p})`, () => {
      const f = binomialCdfTable(c.n, c.p)[c.r] ?? NaN;
      // relative agreement, also in the far lower tail
      expect(Math.abs(f - c.cdf) / c.cdf).toBeLessThan(1e-9);
    });
  }
  it('ends at exactly 1 and never decreases', () => {
    const f = binomialCdfTable(200, 0.37);
    expect(f[200]).toBe(1);
    for (let r = 1; r <= 200; r++) expect(f[r] ?? 0).toBeGreaterThanOrEqual(f[r - 1] ?? 0);
  });
  it('throws RangeError for p outside (0, 1) or n < 1', () => {
    expect(() => binomialCdfTable(10, 0)).toThrow(RangeError);
    expect(() => binomialCdfTable(0, 0.5)).toThrow(RangeError);
  });
});
