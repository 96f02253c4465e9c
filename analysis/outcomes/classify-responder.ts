import type { EpisodeScores, ResponderClassification, ResponderOptions } from './types';
import { changeScore } from './change-score';
import { isResponder } from './is-responder';
import { selectPrimaryFollowUp, DEFAULT_FOLLOW_UP_WINDOW } from './select-primary-follow-up';

/**
 * Responder classification of one episode.
 *
 * Chooses the primary follow-up (see `selectPrimaryFollowUp`), computes the
 * sign-corrected change from baseline and applies the responder threshold.
 * An episode without a baseline or without a follow-up in the window is
 * classified as `missing-baseline` / `missing-follow-up`, not as a
 * non-responder.
 *
 * Cost: O(a) for a assessments.
 *
 * @param episode - baseline (or null) and follow-up assessments. Not modified.
 * @param opts - direction, threshold (> 0) and optional window.
 * @throws RangeError when a score, the threshold or the window is invalid.
 * @returns status, change (or null) and the follow-up used (or null).
 * @example
 * classifyResponder({ baseline: 7, assessments: [{ weeks: 12, value: 3 }] }, { higherIsBetter: false, threshold: 2 });
 * // { status: 'responder', change: 4, followUp: { weeks: 12, value: 3 } }
 */
export function classifyResponder(episode: EpisodeScores, opts: ResponderOptions): ResponderClassification {
  if (!Number.isFinite(opts.threshold) || opts.threshold <= 0) {
    throw new RangeError(`classifyResponder: threshold must be a finite number > 0, got ${opts.threshold}`);
  }
  if (episode.baseline !== null && !Number.isFinite(episode.baseline)) {
    throw new RangeError('classifyResponder: baseline must be a finite number or null');
  }
  const followUp = selectPrimaryFollowUp(episode.assessments, opts.window ?? DEFAULT_FOLLOW_UP_WINDOW);
  if (episode.baseline === null) return { status: 'missing-baseline', change: null, followUp };
  if (followUp === null) return { status: 'missing-follow-up', change: null, followUp: null };
  const change = changeScore(episode.baseline, followUp.value, opts.higherIsBetter);
  return { status: isResponder(change, opts.threshold) ? 'responder' : 'non-responder', change, followUp };
}
