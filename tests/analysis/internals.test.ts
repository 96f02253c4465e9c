import { describe, it, expect } from 'vitest';
import { solveSymmetricPsd, chiSquareUpperTail } from '../../analysis/index';
import { sortNonNegative } from '../../analysis/sort-non-negative';
import { sortTagged } from '../../analysis/sort-tagged';
import { tagSortedTimes } from '../../analysis/tag-sorted-times';
import multi from '../fixtures/stats/logrank-multigroup.json';
import { expectClose } from './helpers/close';

describe('solveSymmetricPsd (Gaussian elimination)', () => {
  it('solves a positive-definite system', () => {
    // [[4, 2], [2, 3]] x = [2, 1] -> x = [0.5, 0]
    const { solution, rank } = solveSymmetricPsd(Float64Array.of(4, 2, 2, 3), Float64Array.of(2, 1));
    expect(rank).toBe(2);
    expectClose(solution[0], 0.5, 1e-12);
    expectClose(solution[1], 0, 1e-12);
  });
  it('reproduces the R survdiff chi-square from its own variance matrix (3 groups)', () => {
    const ref = multi.three_groups;
    const v = ref.var;
    const u = ref.observed.map((o, i) => o - (ref.expected[i] ?? 0));
    const m = Float64Array.of(v[0]?.[0] ?? 0, v[0]?.[1] ?? 0, v[1]?.[0] ?? 0, v[1]?.[1] ?? 0);
    const rhs = Float64Array.of(u[0] ?? 0, u[1] ?? 0);
    const { solution, rank } = solveSymmetricPsd(m, rhs);
    expect(rank).toBe(2);
    expectClose((rhs[0] ?? 0) * (solution[0] ?? 0) + (rhs[1] ?? 0) * (solution[1] ?? 0), ref.chisq);
  });
  it('reports the rank of a singular PSD matrix and zeroes the dropped unknown', () => {
    const { solution, rank } = solveSymmetricPsd(Float64Array.of(2, 0, 0, 0), Float64Array.of(4, 0));
    expect(rank).toBe(1);
    expect(Array.from(solution)).toEqual([2, 0]);
  });
  it('does not modify its inputs and rejects bad shapes or non-finite entries', () => {
    const a = Float64Array.of(4, 2, 2, 3);
    const b = Float64Array.of(2, 1);
    solveSymmetricPsd(a, b);
    expect(Array.from(a)).toEqual([4, 2, 2, 3]);
    expect(Array.from(b)).toEqual([2, 1]);
    expect(() => solveSymmetricPsd(Float64Array.of(1, 2, 3), b)).toThrow(RangeError);
    expect(() => solveSymmetricPsd(Float64Array.of(1, NaN, NaN, 1), b)).toThrow(RangeError);
  });
});

describe('chiSquareUpperTail', () => {
  it('matches known quantiles: 3.841459 (1 df) and 5.991465 (2 df) give 0.05 (R 4.2.2 qchisq(0.95, df), computed for this project)', () => {
    expectClose(chiSquareUpperTail(3.841458820694124, 1), 0.05, 1e-9);
    expectClose(chiSquareUpperTail(5.991464547107979, 2), 0.05, 1e-9);
  });
  it('2 df has the closed form exp(-x/2)', () => {
    expectClose(chiSquareUpperTail(7.3, 2), Math.exp(-3.65), 1e-9);
  });
  it('x = 0 gives 1; invalid input throws RangeError', () => {
    expect(chiSquareUpperTail(0, 3)).toBe(1);
    expect(() => chiSquareUpperTail(-1, 1)).toThrow(RangeError);
    expect(() => chiSquareUpperTail(1, 0)).toThrow(RangeError);
    expect(() => chiSquareUpperTail(1, 1.5)).toThrow(RangeError);
  });
});

describe('sortNonNegative (radix sort used by Kaplan-Meier and log-rank)', () => {
  it('agrees with Float64Array.prototype.sort on 200 000 mixed values with ties, zeros and subnormals', () => {
    let seed = 12345;
    const next = () => {
      seed = (seed * 16807) % 2147483647;
      return seed / 2147483647;
    };
    const values = Float64Array.from({ length: 200_000 }, (_, i) => {
      if (i % 97 === 0) return 0;
      if (i % 101 === 0) return 5e-324;
      if (i % 3 === 0) return Math.floor(next() * 52);
      return -Math.log(next()) * 20;
    });
    const expected = values.slice().sort();
    expect(Array.from(sortNonNegative(values.slice()))).toEqual(Array.from(expected));
  });
  it('sorts a subarray view in place without touching the rest of the buffer', () => {
    const buffer = new Float64Array(100_002);
    buffer[0] = 99;
    buffer[100_001] = -1;
    for (let i = 1; i <= 100_000; i++) buffer[i] = (i * 7919) % 100_003;
    const view = buffer.subarray(1, 100_001);
    const expected = view.slice().sort();
    sortNonNegative(view);
    expect(buffer[0]).toBe(99);
    expect(buffer[100_001]).toBe(-1);
    let ordered = true;
    for (let i = 1; i < view.length; i++) if ((view[i] ?? 0) < (view[i - 1] ?? 0)) ordered = false;
    expect(ordered).toBe(true);
    expect(view.every((v, i) => v === expected[i])).toBe(true);
  });
  it('short arrays use the native sort', () => {
    expect(Array.from(sortNonNegative(Float64Array.of(3, 0.5, 2)))).toEqual([0.5, 2, 3]);
  });
});

describe('sortTagged (radix sort carrying a tag, used by log-rank)', () => {
  const lcg = (seed: number) => () => {
    seed = (seed * 16807) % 2147483647;
    return seed / 2147483647;
  };
  for (const n of [1_000, 2_048, 150_000]) {
    it(`orders values like Float64Array.prototype.sort and keeps each tag with its value (n = ${n})`, () => {
      const next = lcg(n);
      const values = Float64Array.from({ length: n }, (_, i) => (i % 5 === 0 ? Math.floor(next() * 30) : -Math.log(next()) * 20));
      const tags = Int32Array.from({ length: n }, (_, i) => i);
      const original = values.slice();
      sortTagged(values, tags);
      expect(Array.from(values)).toEqual(Array.from(original.slice().sort()));
      // Every tag still points at its own value, and equal values keep their input order (stable).
      for (let i = 0; i < n; i++) {
        expect(original[tags[i] ?? -1]).toBe(values[i]);
        if (i > 0 && values[i] === values[i - 1]) expect(tags[i] ?? 0).toBeGreaterThan(tags[i - 1] ?? 0);
      }
    });
  }
  it('refuses arrays of different lengths', () => {
    expect(() => sortTagged(Float64Array.of(1, 2), Int32Array.of(1))).toThrow(RangeError);
  });
});

describe('tagSortedTimes (one sorted pass over all groups)', () => {
  it('numbers groups by label and tags each time with its group and event flag', () => {
    const result = tagSortedTimes(
      [
        { time: 4, event: true, group: 'b' },
        { time: 1, event: false, group: 'c' },
        { time: 2, event: true, group: 'a' },
        { time: 1, event: true, group: 'b' },
      ],
      'logRank',
    );
    expect(result.labels).toEqual(['a', 'b', 'c']);
    expect(Array.from(result.sizes)).toEqual([1, 2, 1]);
    expect(Array.from(result.times)).toEqual([1, 1, 2, 4]);
    expect(Array.from(result.tags)).toEqual([2 * 2 + 0, 1 * 2 + 1, 0 * 2 + 1, 1 * 2 + 1]);
  });
  it('rejects a non-string group even when it follows a valid row', () => {
    expect(() =>
      tagSortedTimes([{ time: 1, event: true, group: 'a' }, { time: 1, event: true, group: 2 as unknown as string }], 'logRank'),
    ).toThrow(/obs\[1\]\.group must be a string/);
  });
});
