import type { GroupedObs } from './types';
import { assertValidTime } from './assert-valid-time';
import { sortNonNegative } from './sort-non-negative';

/** Event and censoring times per group, each group's block sorted ascending. */
export type GroupedTimes = {
  /** Group labels, sorted by code unit (the order of every per-group array). */
  labels: string[];
  /** Number of observations per group. */
  sizes: Int32Array;
  /** Event times; group g occupies [eventStart[g], eventStart[g + 1]). */
  eventTimes: Float64Array;
  eventStart: Int32Array;
  /** Censoring times; group g occupies [censorStart[g], censorStart[g + 1]). */
  censorTimes: Float64Array;
  censorStart: Int32Array;
};

/**
 * Group, split and sort observation times.
 *
 * The grouped counterpart of `splitSortTimes`: one pass over the objects
 * validates the input, counts events and censorings per group and copies
 * time, event flag and group index into typed arrays; a second pass over
 * those arrays fills contiguous per-group blocks of two typed arrays, and each block is
 * sorted with `sortNonNegative` (a radix sort). Groups are ordered by label
 * (plain code-unit comparison), so the result does not depend on row order.
 *
 * Cost: O(n) time (radix sort), O(n) extra memory (~21 bytes per observation);
 * one `Map` lookup per observation.
 *
 * @param obs - observations; `time` finite and >= 0, `event` boolean,
 *   `group` a string. Not modified.
 * @param caller - name of the calling function, for error messages.
 * @throws RangeError when `obs` is empty, a time is invalid, an event flag is
 *   not boolean or a group label is not a string.
 * @returns the per-group sorted times (see {@link GroupedTimes}).
 * @example
 * groupSortedTimes([{ time: 2, event: true, group: 'b' }, { time: 1, event: false, group: 'a' }], 'logRank').labels;
 * // ['a', 'b']
 */
export function groupSortedTimes(obs: readonly GroupedObs[], caller: string): GroupedTimes {
  const n = obs.length;
  if (n === 0) throw new RangeError(`${caller}: at least one observation is required`);
  const firstSeen = new Map<string, number>();
  const groupOf = new Int32Array(n);
  const times = new Float64Array(n);
  const isEvent = new Uint8Array(n);
  const evCounts: number[] = [];
  const ceCounts: number[] = [];
  for (let i = 0; i < n; i++) {
    const o = obs[i];
    if (o === undefined) throw new RangeError(`${caller}: obs[${i}] is missing`);
    assertValidTime(o.time, i, caller);
    const label = o.group;
    if (typeof label !== 'string') throw new RangeError(`${caller}: obs[${i}].group must be a string`);
    let g = firstSeen.get(label);
    if (g === undefined) {
      g = evCounts.length;
      firstSeen.set(label, g);
      evCounts.push(0);
      ceCounts.push(0);
    }
    groupOf[i] = g;
    times[i] = o.time + 0; // -0 becomes +0 for the bit-pattern sort
    if (o.event === true) {
      isEvent[i] = 1;
      evCounts[g] = (evCounts[g] ?? 0) + 1;
    } else if (o.event === false) ceCounts[g] = (ceCounts[g] ?? 0) + 1;
    else throw new RangeError(`${caller}: obs[${i}].event must be true or false, got ${String(o.event)}`);
  }

  const labels = [...firstSeen.keys()].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  const k = labels.length;
  const rank = new Int32Array(k); // first-seen index -> sorted position
  labels.forEach((label, pos) => {
    rank[firstSeen.get(label) ?? 0] = pos;
  });
  const sizes = new Int32Array(k);
  const eventStart = new Int32Array(k + 1);
  const censorStart = new Int32Array(k + 1);
  for (let g = 0; g < k; g++) {
    const pos = rank[g] ?? 0;
    sizes[pos] = (evCounts[g] ?? 0) + (ceCounts[g] ?? 0);
    eventStart[pos + 1] = evCounts[g] ?? 0;
    censorStart[pos + 1] = ceCounts[g] ?? 0;
  }
  for (let g = 0; g < k; g++) {
    eventStart[g + 1] = (eventStart[g + 1] ?? 0) + (eventStart[g] ?? 0);
    censorStart[g + 1] = (censorStart[g + 1] ?? 0) + (censorStart[g] ?? 0);
  }
  for (let i = 0; i < n; i++) groupOf[i] = rank[groupOf[i] ?? 0] ?? 0;

  const eventTimes = new Float64Array(eventStart[k] ?? 0);
  const censorTimes = new Float64Array(censorStart[k] ?? 0);
  const evPos = eventStart.slice(0, k);
  const cePos = censorStart.slice(0, k);
  for (let i = 0; i < n; i++) {
    const g = groupOf[i] ?? 0;
    if (isEvent[i] === 1) {
      const p = evPos[g] ?? 0;
      eventTimes[p] = times[i] ?? 0;
      evPos[g] = p + 1;
    } else {
      const p = cePos[g] ?? 0;
      censorTimes[p] = times[i] ?? 0;
      cePos[g] = p + 1;
    }
  }
  for (let g = 0; g < k; g++) {
    sortNonNegative(eventTimes.subarray(eventStart[g], eventStart[g + 1]));
    sortNonNegative(censorTimes.subarray(censorStart[g], censorStart[g + 1]));
  }
  return { labels, sizes, eventTimes, eventStart, censorTimes, censorStart };
}
