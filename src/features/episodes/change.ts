// The analysis engine's own rules (imported file by file so the client bundle takes only these two).
import { changeScore } from '../../../analysis/outcomes/change-score';
import { isResponder } from '../../../analysis/outcomes/is-responder';
import type { Assessment } from '../../../shared/schemas/episode';
import type { InstrumentInfo } from '../../../shared/schemas/reference';

/** Change since the start, sign-corrected (positive = better), and whether it reaches the instrument's MCID. */
export type ScoreChange = { change: number; reachedMcid: boolean | null };

/**
 * The change of one follow-up score from the baseline score of the same instrument.
 * `reachedMcid` is null when the instrument has no MCID (e.g. the global rating of change).
 */
export function changeFromBaseline(
  baseline: number | undefined,
  value: number,
  instrument: InstrumentInfo,
): ScoreChange | null {
  if (baseline === undefined || !Number.isFinite(baseline) || !Number.isFinite(value)) return null;
  const change = changeScore(baseline, value, instrument.higherIsBetter);
  const mcid = instrument.mcid;
  return { change, reachedMcid: mcid !== null && mcid > 0 ? isResponder(change, mcid) : null };
}

/** The baseline assessment of an episode, if recorded. */
export const baselineOf = (assessments: Assessment[]) => assessments.find((a) => a.timepoint === 'baseline');

/** Whole weeks since the start of care (week 0 is the first week). */
export const weeksOf = (days: number) => Math.floor(days / 7);
