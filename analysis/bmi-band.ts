import type { BmiBand } from './types';

/**
 * WHO adult BMI band.
 *
 * Classifies a body-mass index (kg/m²) with the WHO adult cut-offs (WHO
 * Technical Report Series 894, 2000): < 18.5 underweight, 18.5 to < 25
 * healthy ("normal range"), 25 to < 30 overweight ("pre-obese"), >= 30 obese.
 * Each band includes its lower cut-off. Meant for adults only.
 *
 * Cost: O(1).
 *
 * @param bmi - body-mass index, finite and > 0.
 * @throws RangeError when `bmi` is not a finite positive number.
 * @returns the band name.
 * @example
 * bmiBand(24.99); // 'healthy'
 * bmiBand(25);    // 'overweight'
 */
export function bmiBand(bmi: number): BmiBand {
  if (typeof bmi !== 'number' || !Number.isFinite(bmi) || bmi <= 0) {
    throw new RangeError(`bmiBand: bmi must be a finite number > 0, got ${String(bmi)}`);
  }
  if (bmi < 18.5) return 'underweight';
  if (bmi < 25) return 'healthy';
  if (bmi < 30) return 'overweight';
  return 'obese';
}
