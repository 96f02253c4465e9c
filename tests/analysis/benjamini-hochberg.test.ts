import { describe, it, expect } from 'vitest';
import { benjaminiHochberg } from '../../analysis/index';
import ref from '../fixtures/stats/benjamini-hochberg.json';
import { expectClose } from './helpers/close';

describe('benjaminiHochberg: Benjamini & Hochberg 1995, section 4 (15 p-values, Neuhaus et al. 1992)', () => {
  it('adjusted values match R p.adjust("BH") / scipy', () => {
    const adj = benjaminiHochberg(ref.p_sorted);
    adj.forEach((a, i) => expectClose(a, ref.bh_adjusted_p[i] ?? null, 1e-9));
  });
  it('4 hypotheses rejected at q = 0.05, as in the paper', () => {
    expect(benjaminiHochberg(ref.p_sorted).filter((a) => a <= ref.q)).toHaveLength(ref.n_rejected_BH);
  });
  it('returns values in the order given (shuffled input)', () => {
    const order = [14, 3, 7, 0, 11, 5, 9, 1, 13, 2, 8, 6, 12, 4, 10];
    const shuffled = Object.freeze(order.map((i) => ref.p_sorted[i] ?? 0));
    const adj = benjaminiHochberg(shuffled);
    order.forEach((i, pos) => expectClose(adj[pos], ref.bh_adjusted_p[i] ?? null, 1e-9));
  });
  it('empty input gives an empty array; one value is unchanged', () => {
    expect(benjaminiHochberg([])).toEqual([]);
    expect(benjaminiHochberg([0.03])).toEqual([0.03]);
  });
  it('tied p-values get the same adjusted value', () => {
    expect(benjaminiHochberg([0.02, 0.02, 0.5])).toEqual([0.03, 0.03, 0.5]);
  });
  it.each([[-0.1], [1.1], [NaN], [Infinity]])('throws RangeError for p = %s', (p) => {
    expect(() => benjaminiHochberg([0.01, p])).toThrow(RangeError);
  });
});
