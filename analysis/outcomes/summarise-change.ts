import jStat from 'jstat';
import { mean, quantileSorted, sampleStandardDeviation } from 'simple-statistics';
import type { ChangeSummary } from './types';
import { changeScore } from './change-score';
import { assertConfLevel } from '../assert-conf-level';

/**
 * Summary of change scores.
 *
 * For paired baseline / follow-up scores: n; the mean sign-corrected change
 * with its t-based confidence interval, mean ± t(1−α/2, n−1)·SD/√n (the
 * paired t interval, Student 1908); the median and quartiles by R's default
 * type-7 definition (linear interpolation at (n−1)p, Hyndman & Fan 1996, cited from memory),
 * which is what simple-statistics 7.12 `quantileSorted` computes (checked in
 * the tests); the standardised response mean SRM = mean change / SD of change
 * (Liang, Fossel & Larson 1990; equals Cohen's d_z, Lakens 2013); and the
 * effect size ES = mean change / SD at baseline (Kazis, Anderson & Meenan
 * 1989). SDs use n − 1.
 *
 * Cost: O(n log n) (sorting for the quantiles).
 *
 * @param pairs - baseline and follow-up scores, finite; at least one pair. Not modified.
 * @param opts - `higherIsBetter` for the sign; `confLevel` in (0, 1), default 0.95.
 * @throws RangeError when `pairs` is empty, a score is not finite or `confLevel` is outside (0, 1).
 * @returns the summary; SD-based values are null when n < 2 or the SD is 0.
 * @example
 * summariseChange([{ baseline: 7, followUp: 3 }, { baseline: 6, followUp: 4 }], { higherIsBetter: false }).meanChange; // 3
 */
export function summariseChange(
  pairs: readonly { baseline: number; followUp: number }[],
  opts: { higherIsBetter: boolean; confLevel?: number },
): ChangeSummary {
  const confLevel = opts.confLevel ?? 0.95;
  assertConfLevel(confLevel);
  const n = pairs.length;
  if (n === 0) throw new RangeError('summariseChange: at least one pair is required');
  const changes = pairs.map((p) => changeScore(p.baseline, p.followUp, opts.higherIsBetter));
  const baselines = pairs.map((p) => p.baseline);
  const sorted = [...changes].sort((a, b) => a - b);
  const meanChange = mean(changes);
  const sdChange = n >= 2 ? sampleStandardDeviation(changes) : null;
  const sdBaseline = n >= 2 ? sampleStandardDeviation(baselines) : null;
  let meanChangeCi: ChangeSummary['meanChangeCi'] = null;
  if (sdChange !== null) {
    const half = (jStat.studentt.inv(1 - (1 - confLevel) / 2, n - 1) * sdChange) / Math.sqrt(n);
    meanChangeCi = { lower: meanChange - half, upper: meanChange + half };
  }
  return {
    n,
    meanChange,
    meanChangeCi,
    sdChange,
    median: quantileSorted(sorted, 0.5),
    q1: quantileSorted(sorted, 0.25),
    q3: quantileSorted(sorted, 0.75),
    sdBaseline,
    srm: sdChange !== null && sdChange > 0 ? meanChange / sdChange : null,
    effectSize: sdBaseline !== null && sdBaseline > 0 ? meanChange / sdBaseline : null,
  };
}
