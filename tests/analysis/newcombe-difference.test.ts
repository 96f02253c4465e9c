import { describe, it, expect } from 'vitest';
import { newcombeDifference } from '../../analysis/index';
import ref from '../fixtures/stats/wilson-newcombe.json';
import { expectClose } from './helpers/close';

describe('newcombeDifference: Newcombe 1998 (Stat Med 17:873) Table II examples (a)-(h), method 10', () => {
  for (const c of ref.difference) {
    it(`(${c.label}) ${c.x1}/${c.n1} - ${c.x2}/${c.n2}`, () => {
      const d = newcombeDifference(c.x1, c.n1, c.x2, c.n2);
      expectClose(d.difference, c.difference);
      expectClose(d.lower, c.method10_score[0] ?? null);
      expectClose(d.upper, c.method10_score[1] ?? null);
    });
  }
  it('(e)/(f): both proportions 0 still give a non-degenerate interval', () => {
    const f = newcombeDifference(0, 10, 0, 10);
    expect(f.lower).toBeLessThan(0);
    expect(f.upper).toBeGreaterThan(0);
  });
  it('(g)/(h): upper limit is exactly 1 when p1 = 1 and p2 = 0', () => {
    expect(newcombeDifference(10, 10, 0, 20).upper).toBe(1);
  });
  it('swapping the groups negates the interval', () => {
    const a = newcombeDifference(56, 70, 48, 80);
    const b = newcombeDifference(48, 80, 56, 70);
    expectClose(b.difference, -a.difference, 1e-12);
    expectClose(b.lower, -a.upper, 1e-12);
    expectClose(b.upper, -a.lower, 1e-12);
  });
  it('throws RangeError for invalid counts or confLevel', () => {
    expect(() => newcombeDifference(11, 10, 1, 10)).toThrow(RangeError);
    expect(() => newcombeDifference(1, 0, 1, 10)).toThrow(RangeError);
    expect(() => newcombeDifference(1, 10, 1, 10, 1)).toThrow(RangeError);
  });
});
