import type { CountCell } from '../../../shared/schemas/cohort';
import type { Suppress } from './small-cells';

/**
 * The attrition table's counts with small cells hidden so that none can be worked out again.
 *
 * The table is a chain: remaining[i − 1] = excluded[i] + remaining[i]. Hiding a small `excluded[i]`
 * alone gives nothing away only while its neighbours are not both known, because the difference of
 * two shown counts would reveal it. So after the small cells are hidden (primary suppression), more
 * cells are withheld one at a time (complementary suppression, as statistical offices do for tables
 * with totals; common practice) until every small cell could still take at least two values. Each
 * round withholds the smallest shown count next to a hidden one, the final count last of all.
 *
 * What a reader can still infer is computed the way a careful reader would: a shown cell is exact,
 * a "<k" cell lies in 1…k−1, a withheld cell is ≥ k (zeros are never withheld, they disclose
 * nothing), and the chain's equations narrow these ranges until nothing changes (bounds
 * propagation, exact for a chain of equations that share one variable with the next).
 *
 * Cost: O(n³) in the worst case for n criteria (a dozen at most).
 */
export function attritionCells(
  total: number,
  excluded: readonly number[],
  s: Suppress,
): { remaining: CountCell[]; excluded: CountCell[] } {
  const n = excluded.length;
  // Variables: remaining R0..Rn at 0..n, excluded E1..En at n + 1..2n. Equation i: R(i−1) = Ei + Ri.
  const values: number[] = [total];
  for (let i = 0; i < n; i++) values.push((values[i] ?? 0) - (excluded[i] ?? 0));
  values.push(...excluded);
  const equations = Array.from({ length: n }, (_, i) => [i, n + 1 + i, i + 1] as const);
  const state: ('shown' | 'small' | 'withheld')[] = values.map((v) => (s.small(v) ? 'small' : 'shown'));
  const k = s.k;
  if (k !== null) {
    for (;;) {
      const { lo, hi } = ranges(values, state, k, equations);
      const exposed = state.some((st, v) => st === 'small' && (hi[v] ?? 0) - (lo[v] ?? 0) < 1);
      if (!exposed) break;
      const pick = nextToWithhold(values, state, equations, n);
      if (pick === -1) break; // nothing left to withhold (a registry of a handful of episodes)
      state[pick] = 'withheld';
    }
  }
  const cell = (v: number): CountCell =>
    state[v] === 'shown' ? (values[v] ?? 0) : state[v] === 'small' ? s.cell(values[v] ?? 0) : 'hidden';
  return {
    remaining: Array.from({ length: n + 1 }, (_, i) => cell(i)),
    excluded: Array.from({ length: n }, (_, i) => cell(n + 1 + i)),
  };
}

/** The smallest non-zero shown count in an equation with a hidden cell (the final count last); -1 if none. */
function nextToWithhold(
  values: readonly number[],
  state: readonly string[],
  equations: readonly (readonly [number, number, number])[],
  n: number,
): number {
  const rank = (v: number) => (v === n ? Infinity : (values[v] ?? 0));
  let pick = -1;
  const consider = (v: number) => {
    if (state[v] === 'shown' && (values[v] ?? 0) > 0 && (pick === -1 || rank(v) < rank(pick))) pick = v;
  };
  for (const eq of equations) if (eq.some((v) => state[v] !== 'shown')) eq.forEach(consider);
  if (pick === -1) values.forEach((_, v) => consider(v));
  return pick;
}

/** What can be inferred about each cell: [lo, hi] after bounds propagation through the chain. */
function ranges(
  values: readonly number[],
  state: readonly string[],
  k: number,
  equations: readonly (readonly [number, number, number])[],
): { lo: number[]; hi: number[] } {
  const lo = values.map((v, i) => (state[i] === 'shown' ? v : state[i] === 'small' ? 1 : k));
  const hi = values.map((v, i) => (state[i] === 'shown' ? v : state[i] === 'small' ? k - 1 : Infinity));
  for (let round = 0, changed = true; changed && round < 1000; round++) {
    changed = false;
    const tighten = (v: number, min: number, max: number) => {
      if (min > (lo[v] ?? 0)) [lo[v], changed] = [min, true];
      if (max < (hi[v] ?? 0)) [hi[v], changed] = [max, true];
    };
    for (const [a, b, c] of equations) {
      // a = b + c
      tighten(a, (lo[b] ?? 0) + (lo[c] ?? 0), (hi[b] ?? 0) + (hi[c] ?? 0));
      tighten(b, (lo[a] ?? 0) - (hi[c] ?? 0), (hi[a] ?? 0) - (lo[c] ?? 0));
      tighten(c, (lo[a] ?? 0) - (hi[b] ?? 0), (hi[a] ?? 0) - (lo[b] ?? 0));
    }
  }
  return { lo, hi };
}
