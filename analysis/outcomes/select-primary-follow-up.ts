import type { Assessment, FollowUpWindow } from './types';
import { assertAssessment } from './assert-assessment';

/** Default primary follow-up: nearest to week 12 within weeks 10–16. */
export const DEFAULT_FOLLOW_UP_WINDOW: FollowUpWindow = Object.freeze({ target: 12, from: 10, to: 16 });

/**
 * Primary follow-up selection.
 *
 * Picks the assessment nearest to the target week (default 12) among those
 * inside the window [from, to] (default 10–16 weeks, both ends included);
 * on a tie in distance the earlier one wins. Three months as the primary
 * time point and the width of the window are common practice, with no
 * published source behind the exact numbers. When nothing falls
 * in the window the result is `null`: the caller must report the episode as
 * missing, never as a non-responder.
 *
 * Cost: O(a) for a assessments.
 *
 * @param assessments - assessments in any order; `weeks` finite >= 0. Not modified.
 * @param window - `from` <= `target` <= `to`, all finite.
 * @throws RangeError when an assessment or the window is invalid.
 * @returns the chosen assessment, or null.
 * @example
 * selectPrimaryFollowUp([{ weeks: 11, value: 4 }, { weeks: 13, value: 2 }]); // { weeks: 11, value: 4 }
 */
export function selectPrimaryFollowUp(
  assessments: readonly Assessment[],
  window: FollowUpWindow = DEFAULT_FOLLOW_UP_WINDOW,
): Assessment | null {
  const { target, from, to } = window;
  if (![target, from, to].every(Number.isFinite) || from > target || target > to) {
    throw new RangeError('selectPrimaryFollowUp: window needs finite from <= target <= to');
  }
  let best: Assessment | null = null;
  let bestDistance = Infinity;
  for (let i = 0; i < assessments.length; i++) {
    const a = assessments[i];
    if (a === undefined) continue;
    assertAssessment(a, `selectPrimaryFollowUp: assessments[${i}]`);
    if (a.weeks < from || a.weeks > to) continue;
    const distance = Math.abs(a.weeks - target);
    if (distance < bestDistance || (distance === bestDistance && best !== null && a.weeks < best.weeks)) {
      best = a;
      bestDistance = distance;
    }
  }
  return best;
}
