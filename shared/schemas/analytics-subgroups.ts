/**
 * The subgroup variables of the outcome dashboards: codes the client and server agree on.
 * The banding functions themselves live in analysis/ (bmiBand, ageBand, symptomDurationBand);
 * only the baseline-severity band, which analysis/ does not have yet, is defined here.
 */
export const SUBGROUP_KEYS = ['activity', 'bmi', 'age', 'sex', 'duration', 'severity'] as const;
export type SubgroupKey = (typeof SUBGROUP_KEYS)[number];

export const SEVERITY_BANDS = ['mild', 'moderate', 'severe'] as const;
export type SeverityBand = (typeof SEVERITY_BANDS)[number];

/**
 * Baseline severity by thirds of the instrument's range, direction-aware (a low function score is severe).
 * On the 0–10 NPRS this gives 0–3 mild, 4–6 moderate, 7–10 severe: common practice, no published source.
 */
export function severityBand(
  value: number,
  instrument: { min: number; max: number; higherIsBetter: boolean },
): SeverityBand {
  const span = instrument.max - instrument.min;
  if (!(span > 0) || !Number.isFinite(value)) throw new RangeError('severityBand: needs a finite value and max > min');
  const position = (value - instrument.min) / span; // 0 = bottom of the scale
  const badness = instrument.higherIsBetter ? 1 - position : position;
  // Cut-points 0.35 / 0.65 keep integer NPRS scores 3 and 7 in the bands clinicians put them in.
  if (badness < 0.35) return 'mild';
  if (badness < 0.65) return 'moderate';
  return 'severe';
}
