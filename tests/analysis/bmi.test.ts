import { describe, it, expect } from 'vitest';
import { bmiBand, bmi } from '../../analysis/index';

describe('bmiBand: WHO TRS 894 (2000) adult cut-offs', () => {
  it.each([
    [18.49, 'underweight'],
    [18.5, 'healthy'],
    [24.99, 'healthy'],
    [25, 'overweight'],
    [29.99, 'overweight'],
    [30, 'obese'],
    [12, 'underweight'],
    [45, 'obese'],
  ] as const)('BMI %s -> %s', (value, band) => {
    expect(bmiBand(value)).toBe(band);
  });
  it.each([[0], [-20], [NaN], [Infinity]])('throws RangeError for %s', (value) => {
    expect(() => bmiBand(value)).toThrow(RangeError);
  });
});

describe('bmi: weight / height² (WHO TRS 894)', () => {
  it('81 kg at 180 cm is exactly 25 (boundary stays overweight)', () => {
    expect(bmi(180, 81)).toBe(25);
    expect(bmiBand(bmi(180, 81))).toBe('overweight');
  });
  it('70 kg at 175 cm is 22.857', () => {
    expect(bmi(175, 70)).toBeCloseTo(22.857142857, 8);
  });
  it.each([
    [0, 70],
    [175, 0],
    [-175, 70],
    [NaN, 70],
    [175, Infinity],
  ])('throws RangeError for height %s, weight %s', (h, w) => {
    expect(() => bmi(h, w)).toThrow(RangeError);
  });
});
