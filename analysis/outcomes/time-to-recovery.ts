import type { ConfType, Obs } from '../types';
import type { RecoveryEpisode, RecoveryRule, TimeToRecoveryReport } from './types';
import { recoveryObservation } from './recovery-observation';
import { DEFAULT_RECOVERY_RULE } from './default-recovery-rule';
import { summariseRecoveryCurve } from './recovery-curve-summary';
import { compareRecoveryBySubgroup } from './recovery-by-subgroup';

/** Options of {@link timeToRecovery}. */
export type TimeToRecoveryOptions = {
  /** Recovery rule, default NPRS first-step pain <= 2 (common practice, no published source). */
  rule?: RecoveryRule;
  /** Weeks at which to read the cumulative share recovered, default [6, 12, 26]. */
  weeks?: readonly number[];
  /** Smallest group that gets estimates, default 10. */
  minGroupSize?: number;
  /** Subgroup variables to report; default every key found in the episodes, sorted. */
  subgroupKeys?: readonly string[];
  confLevel?: number;
  confType?: ConfType;
};

/**
 * Time-to-recovery report.
 *
 * Builds one recovery observation per episode (`recoveryObservation`: event
 * at the first assessment meeting the rule, else censored at the last one),
 * then reports Kaplan-Meier estimates of the cumulative share recovered at
 * the requested weeks (default 6, 12, 26) and the median weeks to recovery,
 * overall and for every level of each subgroup variable, with a log-rank test
 * across the levels (`compareRecoveryBySubgroup`). Groups (including the
 * overall one) with fewer than `minGroupSize` episodes are marked `tooFew`
 * and get no estimates; too-small levels are left out of the log-rank test.
 * Episodes without any assessment are counted in `nWithoutAssessments`.
 *
 * Cost: O(n log n) per subgroup variable plus O(total assessments).
 *
 * @param episodes - assessment series and subgroup values. Not modified.
 * @param opts - see {@link TimeToRecoveryOptions}; `minGroupSize` integer >= 1,
 *   `confLevel` in (0, 1), weeks finite >= 0.
 * @throws RangeError when an assessment, the rule or an option is invalid.
 * @returns the report.
 * @example
 * timeToRecovery(episodes, { subgroupKeys: ['durationBand'] }).overall.summary?.atWeeks;
 */
export function timeToRecovery(
  episodes: readonly RecoveryEpisode[],
  opts: TimeToRecoveryOptions = {},
): TimeToRecoveryReport {
  const rule = opts.rule ?? DEFAULT_RECOVERY_RULE;
  const minGroupSize = opts.minGroupSize ?? 10;
  if (!Number.isInteger(minGroupSize) || minGroupSize < 1) {
    throw new RangeError(`timeToRecovery: minGroupSize must be an integer >= 1, got ${minGroupSize}`);
  }
  const curveOpts = {
    weeks: opts.weeks ?? [6, 12, 26],
    minGroupSize,
    confLevel: opts.confLevel ?? 0.95,
    confType: opts.confType ?? 'log-log',
  };
  const items: { obs: Obs; episode: RecoveryEpisode }[] = [];
  let nWithoutAssessments = 0;
  for (const episode of episodes) {
    const obs = recoveryObservation(episode.series, rule);
    if (obs === null) nWithoutAssessments++;
    else items.push({ obs, episode });
  }
  const allObs = items.map((it) => it.obs);
  const tooFew = allObs.length < minGroupSize;
  const keys =
    opts.subgroupKeys ??
    [...new Set(episodes.flatMap((e) => Object.keys(e.subgroups ?? {})))].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  return {
    rule,
    nEpisodes: episodes.length,
    nWithoutAssessments,
    overall: {
      level: 'all',
      n: allObs.length,
      tooFew,
      summary: tooFew ? null : summariseRecoveryCurve(allObs, curveOpts),
    },
    subgroups: keys.map((key) =>
      compareRecoveryBySubgroup(
        items.map((it) => ({ obs: it.obs, level: it.episode.subgroups?.[key] })),
        key,
        curveOpts,
      ),
    ),
  };
}
