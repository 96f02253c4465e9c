/** Baseline severity bands, mildest first. */
export const SEVERITY_BANDS = ['mild', 'moderate', 'severe'] as const;
export type SeverityBand = (typeof SEVERITY_BANDS)[number];

/**
 * Baseline severity band by thirds of the instrument's range.
 *
 * Direction-aware: on a scale where higher is better (function), a low score
 * is severe. Cut-points at 0.35 and 0.65 of the range keep whole NPRS scores
 * where clinicians put them: 0–3 mild, 4–6 moderate, 7–10 severe (common
 * practice, no published source).
 *
 * Cost: O(1).
 *
 * @param value - the baseline score, finite.
 * @param instrument - the instrument's `min`, `max` (max > min) and `higherIsBetter`.
 * @throws RangeError when `value` is not finite or the range is empty.
 * @returns 'mild', 'moderate' or 'severe'.
 * @example
 * severityBand(7, { min: 0, max: 10, higherIsBetter: false }); // 'severe'
 * severityBand(60, { min: 0, max: 80, higherIsBetter: true }); // 'mild'
 */
export function severityBand(
  value: number,
  instrument: { min: number; max: number; higherIsBetter: boolean },
): SeverityBand {
  const span = instrument.max - instrument.min;
  if (!(span > 0) || !Number.isFinite(value)) throw new RangeError('severityBand: needs a finite value and max > min');
  const position = (value - instrument.min) / span; // 0 = bottom of the scale
  const badness = instrument.higherIsBetter ? 1 - position : position;
  if (badness < 0.35) return 'mild';
  if (badness < 0.65) return 'moderate';
  return 'severe';
}
