import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { kaplanMeier, logRank, benjaminiHochberg, wilsonInterval, newcombeDifference } from '../../analysis/index';
import type { ConfType, GroupedObs } from '../../analysis/index';

// Times on a coarse grid so that ties (events and censorings at one time) are common.
const obsArb = fc.record({
  time: fc.integer({ min: 0, max: 30 }).map((t) => t / 2),
  event: fc.boolean(),
});
const confTypeArb = fc.constantFrom<ConfType>('log', 'log-log', 'plain');
const TOL = 1e-12;

describe('properties: kaplanMeier', () => {
  it('survival is in [0, 1] and never increases; lower <= S <= upper where defined; bounds in [0, 1]', () => {
    fc.assert(
      fc.property(
        fc.array(obsArb, { minLength: 1, maxLength: 60 }),
        confTypeArb,
        fc.double({ min: 0.5, max: 0.999, noNaN: true }),
        (obs, confType, confLevel) => {
          const { steps, median } = kaplanMeier(obs, { confType, confLevel });
          let prev = 1;
          for (const s of steps) {
            expect(s.survival).toBeGreaterThanOrEqual(0);
            expect(s.survival).toBeLessThanOrEqual(prev + TOL);
            prev = s.survival;
            if (s.lower !== null) {
              expect(s.lower).toBeGreaterThanOrEqual(0);
              expect(s.lower).toBeLessThanOrEqual(s.survival + TOL);
            }
            if (s.upper !== null) {
              expect(s.upper).toBeLessThanOrEqual(1);
              expect(s.upper).toBeGreaterThanOrEqual(s.survival - TOL);
            }
          }
          // counts add up: everybody leaves the risk set exactly once
          expect(steps.reduce((n, s) => n + s.nEvent + s.nCensor, 0)).toBe(obs.length);
          // median limits bracket the estimate when all three exist
          if (median.estimate !== null && median.lower !== null)
            expect(median.lower).toBeLessThanOrEqual(median.estimate);
          if (median.estimate !== null && median.upper !== null)
            expect(median.upper).toBeGreaterThanOrEqual(median.estimate);
        },
      ),
    );
  });
  it('does not depend on the order of the observations', () => {
    fc.assert(
      fc.property(fc.array(obsArb, { minLength: 1, maxLength: 40 }), (obs) => {
        expect(kaplanMeier([...obs].reverse())).toEqual(kaplanMeier(obs));
      }),
    );
  });
});

describe('properties: logRank', () => {
  const groupedArb = fc
    .array(
      fc.record({ time: fc.integer({ min: 0, max: 20 }), event: fc.boolean(), g: fc.integer({ min: 0, max: 3 }) }),
      {
        minLength: 4,
        maxLength: 60,
      },
    )
    .filter((rows) => new Set(rows.map((r) => r.g)).size >= 2 && rows.some((r) => r.event));

  it('is invariant to renaming the groups and to row order', () => {
    fc.assert(
      fc.property(
        groupedArb,
        fc.shuffledSubarray(['w', 'x', 'y', 'z', 'q', 'r'], { minLength: 4, maxLength: 4 }),
        (rows, names) => {
          const a: GroupedObs[] = rows.map((r) => ({ time: r.time, event: r.event, group: `g${r.g}` }));
          const b: GroupedObs[] = rows
            .map((r) => ({ time: r.time, event: r.event, group: names[r.g] ?? '' }))
            .reverse();
          let ra: ReturnType<typeof logRank> | null = null;
          try {
            ra = logRank(a);
          } catch (err) {
            expect(err).toBeInstanceOf(RangeError);
            expect(() => logRank(b)).toThrow(RangeError);
            return;
          }
          const rb = logRank(b);
          expect(rb.df).toBe(ra.df);
          expect(Math.abs(rb.chiSquare - ra.chiSquare)).toBeLessThanOrEqual(1e-8 * Math.max(1, ra.chiSquare));
          expect(ra.pValue).toBeGreaterThanOrEqual(0);
          expect(ra.pValue).toBeLessThanOrEqual(1);
          const sumO = ra.groups.reduce((s, g) => s + g.observed, 0);
          const sumE = ra.groups.reduce((s, g) => s + g.expected, 0);
          expect(Math.abs(sumO - sumE)).toBeLessThan(1e-9 * Math.max(1, sumO));
        },
      ),
    );
  });
});

describe('properties: benjaminiHochberg', () => {
  it('adjusted >= raw, <= 1, and monotone in the order of the sorted raw p-values', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 50 }), (ps) => {
        const adj = benjaminiHochberg(ps);
        expect(adj).toHaveLength(ps.length);
        adj.forEach((a, i) => {
          expect(a).toBeGreaterThanOrEqual(ps[i] ?? 0);
          expect(a).toBeLessThanOrEqual(1);
        });
        const order = ps.map((p, i) => [p, i] as const).sort((x, y) => x[0] - y[0]);
        for (let k = 1; k < order.length; k++) {
          expect(adj[order[k]?.[1] ?? 0] ?? 0).toBeGreaterThanOrEqual(adj[order[k - 1]?.[1] ?? 0] ?? 0);
        }
      }),
    );
  });
});

describe('properties: wilsonInterval and newcombeDifference', () => {
  const countArb = fc
    .integer({ min: 1, max: 500 })
    .chain((n) => fc.tuple(fc.integer({ min: 0, max: n }), fc.constant(n)));
  it('Wilson bounds lie in [0, 1] and contain the estimate', () => {
    fc.assert(
      fc.property(countArb, fc.double({ min: 0.5, max: 0.999, noNaN: true }), ([x, n], c) => {
        const w = wilsonInterval(x, n, c);
        expect(w.lower).toBeGreaterThanOrEqual(0);
        expect(w.upper).toBeLessThanOrEqual(1);
        expect(w.lower).toBeLessThanOrEqual(w.estimate);
        expect(w.upper).toBeGreaterThanOrEqual(w.estimate);
      }),
    );
  });
  it('Newcombe bounds lie in [-1, 1] and contain the difference', () => {
    fc.assert(
      fc.property(countArb, countArb, ([x1, n1], [x2, n2]) => {
        const d = newcombeDifference(x1, n1, x2, n2);
        expect(d.lower).toBeGreaterThanOrEqual(-1);
        expect(d.upper).toBeLessThanOrEqual(1);
        expect(d.lower).toBeLessThanOrEqual(d.difference + TOL);
        expect(d.upper).toBeGreaterThanOrEqual(d.difference - TOL);
      }),
    );
  });
});
