import { describe, expect, it } from 'vitest';
import { AnalyticsFiltersSchema, canonicalFilters } from '../../shared/schemas/analytics-filters';

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
