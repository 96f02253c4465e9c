import { describe, it, expect } from 'vitest';
import { ageBand, symptomDurationBand, compareWithTarget, stratumKey, severityBand } from '../../analysis/index';

describe('ageBand: 5-year bands, 90+ top-coded (common practice, no published source)', () => {
  it.each([
    [0, '0-4'],
    [4.99, '0-4'],
    [5, '5-9'],
    [40, '40-44'],
    [44.9, '40-44'],
    [45, '45-49'],
    [89.99, '85-89'],
    [90, '90+'],
    [104, '90+'],
  ] as const)('%s -> %s', (age, band) => {
    expect(ageBand(age)).toBe(band);
  });
  it.each([[-1], [NaN], [Infinity]])('throws RangeError for %s', (age) => {
    expect(() => ageBand(age)).toThrow(RangeError);
  });
});

describe('symptomDurationBand: 13 and 52 weeks', () => {
  it.each([
    [0, '<3m'],
    [12.99, '<3m'],
    [13, '3-12m'],
    [52, '3-12m'],
    [52.01, '>12m'],
    [200, '>12m'],
  ] as const)('%s weeks -> %s', (weeks, band) => {
    expect(symptomDurationBand(weeks)).toBe(band);
  });
  it.each([[-0.5], [NaN]])('throws RangeError for %s', (weeks) => {
    expect(() => symptomDurationBand(weeks)).toThrow(RangeError);
  });
});

describe('compareWithTarget: interval against the three-month expectation', () => {
  it('above when the lower bound exceeds the target, below when the upper bound is under it, else within', () => {
    expect(compareWithTarget({ lower: 0.62, upper: 0.78 }, 0.5)).toBe('above');
    expect(compareWithTarget({ lower: 0.22, upper: 0.41 }, 0.5)).toBe('below');
    expect(compareWithTarget({ lower: 0.45, upper: 0.6 }, 0.5)).toBe('within');
    expect(compareWithTarget({ lower: 0.5, upper: 0.6 }, 0.5)).toBe('within'); // touching is not above
  });
  it('a null bound cannot support a claim on its side', () => {
    expect(compareWithTarget({ lower: null, upper: 0.3 }, 0.5)).toBe('below');
    expect(compareWithTarget({ lower: null, upper: null }, 0.5)).toBe('within');
  });
  it('throws RangeError for a non-finite target or crossed bounds', () => {
    expect(() => compareWithTarget({ lower: 0.1, upper: 0.2 }, NaN)).toThrow(RangeError);
    expect(() => compareWithTarget({ lower: 0.3, upper: 0.2 }, 0.5)).toThrow(RangeError);
  });
});

describe('stratumKey', () => {
  it('joins parts; any missing part gives null', () => {
    expect(stratumKey('active', '3-12m')).toBe('active × 3-12m');
    expect(stratumKey('active', null)).toBeNull();
    expect(stratumKey('', '<3m')).toBeNull();
    expect(stratumKey()).toBeNull();
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
