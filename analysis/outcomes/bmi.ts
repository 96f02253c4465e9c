/**
 * Body-mass index.
 *
 * BMI = weight (kg) / height (m)², the Quetelet index used by the WHO adult
 * classification (WHO Technical Report Series 894, 2000); height is given in
 * centimetres and converted to metres.
 *
 * Cost: O(1).
 *
 * @param heightCm - height in centimetres, finite and > 0.
 * @param weightKg - weight in kilograms, finite and > 0.
 * @throws RangeError when either value is not a finite positive number.
 * @returns BMI in kg/m² (unrounded).
 * @example
 * bmi(180, 81); // 25
 */
export function bmi(heightCm: number, weightKg: number): number {
  if (typeof heightCm !== 'number' || !Number.isFinite(heightCm) || heightCm <= 0) {
    throw new RangeError(`bmi: heightCm must be a finite number > 0, got ${String(heightCm)}`);
  }
  if (typeof weightKg !== 'number' || !Number.isFinite(weightKg) || weightKg <= 0) {
    throw new RangeError(`bmi: weightKg must be a finite number > 0, got ${String(weightKg)}`);
  }
  // kg·10⁴/cm² rather than kg/(cm/100)²: 81 kg at 180 cm gives exactly 25, not 24.999…
  return (weightKg * 10000) / (heightCm * heightCm);
}
