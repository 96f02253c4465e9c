import type { ConfType, GroupedObs, Obs } from '../types';
import type { RecoveryGroup, RecoverySubgroupComparison } from './types';
import { logRank } from '../log-rank';
import { summariseRecoveryCurve } from './recovery-curve-summary';

/**
 * Time to recovery by the levels of one subgroup variable.
 *
 * Splits recovery observations by level, summarises each level with at least
 * `minGroupSize` episodes (see `summariseRecoveryCurve`) and marks smaller
 * levels `tooFew` with no estimates. The log-rank test (`logRank`, k − 1 df)
 * compares only the levels that are not `tooFew`; it is null, with a note,
 * when fewer than two such levels exist or the test is undefined (e.g. no
 * recoveries). Episodes without a level are counted in `nMissingLevel`.
 *
 * Cost: O(n log n).
 *
 * @param items - observation and level per episode (null/undefined/'' = missing). Not modified.
 * @param key - the subgroup variable's name (echoed in the result).
 * @param opts - `weeks`; `minGroupSize` (integer >= 1); `confLevel`; `confType`.
 * @throws RangeError as `summariseRecoveryCurve` does, or when `minGroupSize` is not a positive integer.
 * @returns per-level summaries and the log-rank result.
 * @example
 * compareRecoveryBySubgroup(items, 'sex', { weeks: [6, 12, 26], minGroupSize: 10 }).logRank?.pValue;
 */
export function compareRecoveryBySubgroup(
  items: readonly { obs: Obs; level: string | null | undefined }[],
  key: string,
  opts: { weeks: readonly number[]; minGroupSize: number; confLevel?: number; confType?: ConfType },
): RecoverySubgroupComparison {
  if (!Number.isInteger(opts.minGroupSize) || opts.minGroupSize < 1) {
    throw new RangeError(`compareRecoveryBySubgroup: minGroupSize must be an integer >= 1, got ${opts.minGroupSize}`);
  }
  const byLevel = new Map<string, Obs[]>();
  let nMissingLevel = 0;
  for (const { obs, level } of items) {
    if (level === null || level === undefined || level === '') {
      nMissingLevel++;
      continue;
    }
    const list = byLevel.get(level);
    if (list) list.push(obs);
    else byLevel.set(level, [obs]);
  }
  const labels = [...byLevel.keys()].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  const eligible: GroupedObs[] = [];
  let nEligibleLevels = 0;
  const levels: RecoveryGroup[] = labels.map((level) => {
    const obs = byLevel.get(level) ?? [];
    const tooFew = obs.length < opts.minGroupSize;
    if (!tooFew) {
      nEligibleLevels++;
      for (const o of obs) eligible.push({ time: o.time, event: o.event, group: level });
    }
    return { level, n: obs.length, tooFew, summary: tooFew ? null : summariseRecoveryCurve(obs, opts) };
  });

  let result: RecoverySubgroupComparison['logRank'] = null;
  let note: string | null = null;
  if (nEligibleLevels < 2) {
    note = `fewer than two levels with at least ${opts.minGroupSize} episodes`;
  } else {
    try {
      result = logRank(eligible);
    } catch (err) {
      if (!(err instanceof RangeError)) throw err;
      note = err.message;
    }
  }
  return { key, nMissingLevel, levels, logRank: result, logRankNote: note };
}
