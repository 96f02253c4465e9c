import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  generalise,
  planGeneralisation,
  qiKey,
  widenAgeBand,
  startPeriod,
  type Qi,
} from '../../server/services/exports/generalise';

const AGE = ['15-19', '20-24', '35-39', '40-44', '45-49', '60-64', '85-89', '90+'];
const qiArb = fc.record({
  ageBand: fc.constantFrom(...AGE),
  sex: fc.constantFrom('female', 'male', 'other'),
  bmiBand: fc.constantFrom('underweight', 'healthy', 'overweight', 'obese'),
  activity: fc.constantFrom('runner', 'active', 'sedentary'),
  period: fc.constantFrom('2023-Q1', '2023-Q3', '2024-Q2', '2025-Q4'),
  region: fc.constantFrom('North', 'South', 'East'),
});

/** Applies a plan to rows, as the export does, and returns the exported combinations. */
function exported(rows: Qi[], k: number) {
  const counts = new Map<string, { qi: Qi; n: number }>();
  for (const q of rows) {
    const c = counts.get(qiKey(q));
    if (c) c.n++;
    else counts.set(qiKey(q), { qi: q, n: 1 });
  }
  const plan = planGeneralisation(counts, k);
  const out: string[] = [];
  for (const q of rows) {
    const d = plan.decision.get(qiKey(q));
    if (d !== undefined && d !== 'suppress') out.push(qiKey(generalise(q, d)));
  }
  return { plan, out };
}

describe('k-anonymity plan', () => {
  it('leaves every exported combination with at least k rows and accounts for every row', () => {
    fc.assert(
      fc.property(fc.array(qiArb, { maxLength: 400 }), fc.integer({ min: 3, max: 12 }), (rows, k) => {
        const { plan, out } = exported(rows, k);
        const sizes = new Map<string, number>();
        for (const key of out) sizes.set(key, (sizes.get(key) ?? 0) + 1);
        for (const n of sizes.values()) expect(n).toBeGreaterThanOrEqual(k);
        expect(plan.keptRows + plan.suppressedRows).toBe(rows.length);
        expect(out.length).toBe(plan.keptRows);
        expect(plan.generalisedRows).toBeLessThanOrEqual(plan.keptRows);
      }),
      { numRuns: 300 },
    );
  });

  it('keeps common combinations exact, merges rare neighbours into a wider band, drops what stays rare', () => {
    const common: Qi = {
      ageBand: '60-64',
      sex: 'female',
      bmiBand: 'healthy',
      activity: 'runner',
      period: '2024',
      region: 'North',
    };
    const a: Qi = { ...common, ageBand: '40-44' };
    const b: Qi = { ...common, ageBand: '45-49' };
    const lone: Qi = { ...common, ageBand: '20-24', sex: 'male', activity: 'sedentary' };
    const rows = [...Array(6).fill(common), ...Array(2).fill(a), ...Array(3).fill(b), ...Array(2).fill(lone)];
    const { plan, out } = exported(rows, 5);
    expect(out.filter((key) => key === qiKey(common))).toHaveLength(6);
    expect(out.filter((key) => key.startsWith('40-49'))).toHaveLength(5);
    expect(plan.generalisedRows).toBe(5);
    expect(plan.suppressedRows).toBe(2);
  });

  it('widens 5-year bands to 10 and 20 years with the top code kept', () => {
    expect([
      widenAgeBand('40-44', 10),
      widenAgeBand('45-49', 10),
      widenAgeBand('90+', 10),
      widenAgeBand('85-89', 10),
    ]).toEqual(['40-49', '40-49', '90+', '80-89']);
    expect([
      widenAgeBand('15-19', 20),
      widenAgeBand('55-59', 20),
      widenAgeBand('85-89', 20),
      widenAgeBand('90+', 20),
    ]).toEqual(['0-19', '40-59', '80+', '80+']);
    expect([
      startPeriod('2024-03-31', 'quarter'),
      startPeriod('2024-04-01', 'quarter'),
      startPeriod('2024-12-31', 'year'),
    ]).toEqual(['2024-Q1', '2024-Q2', '2024']);
  });
});
