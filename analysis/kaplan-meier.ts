import type { ConfType, KaplanMeierOptions, KaplanMeierResult, KaplanMeierStep, Obs } from './types';
import { twoSidedZ } from './two-sided-z';
import { splitSortTimes } from './split-sort-times';
import { kmInterval } from './km-interval';
import { MedianTracker } from './median-tracker';

const CONF_TYPES: readonly ConfType[] = ['log', 'log-log', 'plain'];

/**
 * Kaplan-Meier product-limit estimate.
 *
 * Estimates the share still "not recovered" S(t) from right-censored times
 * (Kaplan & Meier 1958, J Am Stat Assoc; cited from memory), with the Greenwood standard error of S itself,
 * SE = S·√Σ d/(n(n−d)), and a pointwise confidence interval. Conventions
 * follow R `survival::survfit` (survival 3.5): at a tied time events are
 * counted before censorings (someone censored at t is at risk at t); the
 * `'log'` interval's upper bound is truncated at 1 and `'plain'` is truncated
 * to [0, 1]; the default transform here is `'log-log'`. There is one step per
 * distinct time, event or censoring, ascending. Where S = 0 the Greenwood SE
 * is undefined: `stdErr` is `NaN` and both bounds are `null` (R prints NaN /
 * NA). Under `'log-log'` the bounds are also `null` while S = 1. The median
 * is the first time with S <= 0.5, or the midpoint rule of
 * {@link MedianTracker} when S = 0.5 exactly; its limits apply the same rule to
 * the lower and upper bound columns (`null` = not reached).
 *
 * Cost: O(n) time for the radix sort (`sortNonNegative`; the native
 * O(n log n) sort below 2 048 values) plus O(n) for the sweep; O(n) memory.
 * The output has one object per distinct time, so with continuous times it
 * is the output itself (~n objects) that dominates time and memory.
 *
 * @param obs - observations; `time` finite and >= 0 (weeks), `event` boolean.
 *   Not modified.
 * @param opts - `confLevel` in (0, 1), default 0.95; `confType`, default `'log-log'`.
 * @throws RangeError when `obs` is empty, a time is negative or not finite,
 *   an event flag is not boolean, `confLevel` is outside (0, 1) or
 *   `confType` is unknown.
 * @returns the step table and the median with its limits.
 * @example
 * const km = kaplanMeier([{ time: 1, event: true }, { time: 2, event: false }], { confType: 'log' });
 * km.steps[0].survival; // 0.5
 */
export function kaplanMeier(obs: readonly Obs[], opts: KaplanMeierOptions = {}): KaplanMeierResult {
  const confLevel = opts.confLevel ?? 0.95;
  const confType = opts.confType ?? 'log-log';
  if (!CONF_TYPES.includes(confType)) {
    throw new RangeError(`kaplanMeier: confType must be 'log', 'log-log' or 'plain', got ${String(confType)}`);
  }
  const z = twoSidedZ(confLevel);
  const { eventTimes, censorTimes } = splitSortTimes(obs, 'kaplanMeier');
  const nEv = eventTimes.length;
  const nCe = censorTimes.length;

  const steps: KaplanMeierStep[] = [];
  const interval = new Float64Array(2);
  let i = 0;
  let j = 0;
  let nRisk = obs.length;
  let survival = 1;
  let greenwood = 0;
  // Values carried over censoring-only steps, where S and its SE do not change.
  let stdErr = 0;
  let lower: number | null = null;
  let upper: number | null = null;
  const medians = [new MedianTracker(), new MedianTracker(), new MedianTracker()] as const;
  while (i < nEv || j < nCe) {
    const te = i < nEv ? (eventTimes[i] ?? Infinity) : Infinity;
    const tc = j < nCe ? (censorTimes[j] ?? Infinity) : Infinity;
    const t = te < tc ? te : tc;
    let d = 0;
    while (i < nEv && eventTimes[i] === t) {
      d++;
      i++;
    }
    let c = 0;
    while (j < nCe && censorTimes[j] === t) {
      c++;
      j++;
    }
    if (d > 0 || steps.length === 0) {
      if (d > 0) {
        survival *= (nRisk - d) / nRisk;
        greenwood += d < nRisk ? d / (nRisk * (nRisk - d)) : Infinity;
      }
      stdErr = survival > 0 ? survival * Math.sqrt(greenwood) : NaN;
      kmInterval(survival, greenwood, z, confType, interval);
      const lo = interval[0] ?? NaN;
      const up = interval[1] ?? NaN;
      lower = Number.isNaN(lo) ? null : lo;
      upper = Number.isNaN(up) ? null : up;
      medians[0].update(t, survival);
      medians[1].update(t, lower);
      medians[2].update(t, upper);
    }
    steps.push({ time: t, nRisk, nEvent: d, nCensor: c, survival, stdErr, lower, upper });
    nRisk -= d + c;
  }

  return {
    steps,
    median: { estimate: medians[0].result(), lower: medians[1].result(), upper: medians[2].result() },
  };
}
