import { describe, expect, it } from 'vitest';
import { attritionCells } from '../../server/services/cohorts/attrition-cells';
import type { Suppress } from '../../server/services/cohorts/small-cells';
import { smallCellValues } from './attrition-leak';

const researcherView = (k: number): Suppress => {
  const small = (n: number) => n > 0 && n < k;
  return { k, small, cell: (n) => (small(n) ? `<${k}` : n) };
};
const exact: Suppress = { k: null, small: () => false, cell: (n) => n };

function table(total: number, excluded: number[], s: Suppress) {
  const c = attritionCells(total, excluded, s);
  return [
    { excluded: 0, remaining: c.remaining[0]! },
    ...excluded.map((_, i) => ({ excluded: c.excluded[i]!, remaining: c.remaining[i + 1]! })),
  ];
}

describe('attrition table: small cells cannot be worked out by subtraction (complementary suppression)', () => {
  it('shows every count to the steward', () => {
    expect(table(100, [3, 40, 2], exact).map((r) => [r.excluded, r.remaining])).toEqual([
      [0, 100],
      [3, 97],
      [40, 57],
      [2, 55],
    ]);
  });

  it('leaves a table without small cells alone', () => {
    const rows = table(100, [10, 0, 30], researcherView(5));
    expect(rows.map((r) => r.remaining)).toEqual([100, 90, 90, 60]);
  });

  it('hides a neighbour of each small cell, and each small cell can still take at least two values', () => {
    const cases: [number, number[]][] = [
      [100, [3, 40, 20]], // small first step
      [100, [30, 40, 2]], // small last step
      [100, [30, 4, 20, 1, 12]], // two small steps
      [60, [20, 36, 2]], // small remaining count at the end
      [50, [1, 2, 3, 4]], // everything small
      [80, [0, 3, 0, 50]], // zeros next to a small cell
    ];
    for (const [total, excluded] of cases) {
      const rows = table(total, excluded, researcherView(5));
      const values = smallCellValues(rows, 5);
      const small = rows.flatMap((r, i) =>
        [r.excluded, r.remaining].filter((c) => typeof c === 'string' && c.startsWith('<')).map(() => i),
      );
      expect(small.length, JSON.stringify(rows)).toBeGreaterThan(0);
      for (const [key, set] of values) expect(set.size, `${key} in ${JSON.stringify(rows)}`).toBeGreaterThanOrEqual(2);
      // Shown counts are the true ones.
      let r = total;
      excluded.forEach((e, i) => {
        r -= e;
        const row = rows[i + 1]!;
        if (typeof row.excluded === 'number') expect(row.excluded).toBe(e);
        if (typeof row.remaining === 'number') expect(row.remaining).toBe(r);
      });
    }
  });

  it('holds on 400 random tables (totals 20–60, 2–5 criteria, k = 5)', () => {
    let seed = 20261202;
    const next = (m: number) => {
      seed = (seed * 16807) % 2147483647;
      return seed % m;
    };
    let checked = 0;
    let withSmall = 0;
    for (let t = 0; t < 400; t++) {
      const total = 20 + next(41);
      let left = total;
      const excluded = Array.from({ length: 2 + next(4) }, () => {
        const e = Math.min(left, next(3) === 0 ? next(5) : next(Math.max(1, Math.floor(left / 2))));
        left -= e;
        return e;
      });
      const rows = table(total, excluded, researcherView(5));
      if (typeof rows[0]!.remaining !== 'number') continue;
      checked++;
      if (JSON.stringify(rows).includes('"<5"')) withSmall++;
      for (const [key, set] of smallCellValues(rows, 5))
        expect(set.size, `${key} in ${JSON.stringify(rows)}`).toBeGreaterThanOrEqual(2);
    }
    expect(checked).toBeGreaterThan(350);
    expect(withSmall).toBeGreaterThan(100);
  });

  it('the check itself catches a table that hides a small cell alone', () => {
    const naive = [
      { excluded: 0, remaining: 100 },
      { excluded: '<5', remaining: 97 },
      { excluded: 40, remaining: 57 },
    ];
    expect(smallCellValues(naive, 5).get('excluded 1')).toEqual(new Set([3]));
  });
});
