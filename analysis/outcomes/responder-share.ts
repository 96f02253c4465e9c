import type { EpisodeScores, ResponderOptions, ResponderShare } from './types';
import { classifyResponder } from './classify-responder';
import { wilsonInterval } from '../wilson-interval';

/**
 * Responder share over a set of episodes.
 *
 * Classifies every episode (see `classifyResponder`) and reports the share of
 * responders among the episodes that have both a baseline and a primary
 * follow-up, with a Wilson score interval (Newcombe 1998, method 3). Episodes
 * missing either are counted separately and excluded from the denominator;
 * none is dropped silently.
 *
 * Cost: O(total assessments).
 *
 * @param episodes - episodes; may be empty. Not modified.
 * @param opts - direction, threshold (> 0), optional window, `confLevel` in (0, 1) (default 0.95).
 * @throws RangeError when a score, the threshold, the window or `confLevel` is invalid.
 * @returns counts and the share (null when no episode could be analysed).
 * @example
 * responderShare(episodes, { higherIsBetter: false, threshold: 2 }).share?.estimate;
 */
export function responderShare(
  episodes: readonly EpisodeScores[],
  opts: ResponderOptions & { confLevel?: number },
): ResponderShare {
  let nMissingBaseline = 0;
  let nMissingFollowUp = 0;
  let responders = 0;
  let nAnalysed = 0;
  for (const episode of episodes) {
    const { status } = classifyResponder(episode, opts);
    if (status === 'missing-baseline') nMissingBaseline++;
    else if (status === 'missing-follow-up') nMissingFollowUp++;
    else {
      nAnalysed++;
      if (status === 'responder') responders++;
    }
  }
  return {
    nEpisodes: episodes.length,
    nMissingBaseline,
    nMissingFollowUp,
    nAnalysed,
    responders,
    share: nAnalysed > 0 ? wilsonInterval(responders, nAnalysed, opts.confLevel ?? 0.95) : null,
  };
}
