import { describe, expect, it } from 'vitest';
import { AnalyticsFiltersSchema, canonicalFilters } from '../../shared/schemas/analytics-filters';
import { severityBand } from '../../shared/schemas/analytics-subgroups';

describe('analytics filters', () => {
  it('applies the defaults and gives the same canonical form whatever the key order', () => {
    const a = AnalyticsFiltersSchema.parse({ instrument: 'lefs', groupBy: 'sex', clinic: '12' });
    const b = AnalyticsFiltersSchema.parse({ clinic: '12', groupBy: 'sex', instrument: 'lefs' });
    expect(a.clinic).toBe(12);
    expect(canonicalFilters(a)).toBe(canonicalFilters(b));
    expect(AnalyticsFiltersSchema.parse({})).toEqual({ instrument: 'nprs-first-step', groupBy: 'activity' });
  });

  it('refuses unknown keys, impossible dates, reversed periods and a subgroup without its level', () => {
    for (const bad of [
      { colour: 'red' },
      { from: '2025-02-30' },
      { from: '2025-03-01', to: '2025-01-01' },
      { subgroup: 'bmi' },
      { clinic: '-1' },
    ]) {
      expect(AnalyticsFiltersSchema.safeParse(bad).success, JSON.stringify(bad)).toBe(false);
    }
  });
});

describe('baseline severity band (thirds of the range; common practice, no published source)', () => {
  const nprs = { min: 0, max: 10, higherIsBetter: false };
  const lefs = { min: 0, max: 80, higherIsBetter: true };
  it('puts NPRS 0–3 in mild, 4–6 in moderate and 7–10 in severe', () => {
    expect([0, 3, 4, 6, 7, 10].map((v) => severityBand(v, nprs))).toEqual([
      'mild',
      'mild',
      'moderate',
      'moderate',
      'severe',
      'severe',
    ]);
  });
  it('reads a function scale the other way round (low function is severe)', () => {
    expect([80, 60, 40, 10].map((v) => severityBand(v, lefs))).toEqual(['mild', 'mild', 'moderate', 'severe']);
    expect(() => severityBand(5, { min: 3, max: 3, higherIsBetter: false })).toThrow(RangeError);
  });
});
