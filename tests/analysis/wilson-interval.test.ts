import { describe, it, expect } from 'vitest';
import { wilsonInterval } from '../../analysis/index';
import ref from '../fixtures/stats/wilson-newcombe.json';
import { expectClose } from './helpers/close';

describe('wilsonInterval: Newcombe 1998 (Stat Med 17:857) worked examples, method 3', () => {
  for (const c of ref.single_proportion) {
    it(`${c.x}/${c.n} -> ${c.wilson_method3[0]?.toFixed(6)}-${c.wilson_method3[1]?.toFixed(6)}`, () => {
      const w = wilsonInterval(c.x, c.n);
      expectClose(w.estimate, c.p);
      expectClose(w.lower, c.wilson_method3[0] ?? null);
      expectClose(w.upper, c.wilson_method3[1] ?? null);
    });
  }
  it('0 successes gives lower bound exactly 0; n successes gives upper exactly 1', () => {
    expect(wilsonInterval(0, 20).lower).toBe(0);
    expect(wilsonInterval(20, 20).upper).toBe(1);
  });
  it('symmetry: x/n and (n-x)/n mirror each other', () => {
    const a = wilsonInterval(15, 148);
    const b = wilsonInterval(133, 148);
    expectClose(a.lower, 1 - b.upper, 1e-12);
    expectClose(a.upper, 1 - b.lower, 1e-12);
  });
  it('a 90% interval is inside the 95% interval', () => {
    const w95 = wilsonInterval(81, 263);
    const w90 = wilsonInterval(81, 263, 0.9);
    expect(w90.lower).toBeGreaterThan(w95.lower);
    expect(w90.upper).toBeLessThan(w95.upper);
  });
});

describe('wilsonInterval: RangeErrors', () => {
  it.each([
    [5, 0],
    [-1, 10],
    [11, 10],
    [1.5, 10],
    [1, 2.5],
    [NaN, 10],
  ])('successes %s, n %s', (x, n) => {
    expect(() => wilsonInterval(x, n)).toThrow(RangeError);
  });
  it.each([[0], [1], [NaN], [2]])('confLevel %s', (c) => {
    expect(() => wilsonInterval(1, 10, c)).toThrow(RangeError);
  });
});
