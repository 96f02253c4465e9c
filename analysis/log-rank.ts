import type { GroupedObs, LogRankResult } from './types';
import { tagSortedTimes } from './tag-sorted-times';
import { solveSymmetricPsd } from './solve-symmetric-psd';
import { chiSquareUpperTail } from './chi-square-upper-tail';

/**
 * Log-rank test for k >= 2 groups.
 *
 * Compares time-to-event distributions across groups with the Mantel-Haenszel
 * (Mantel 1966; Peto & Peto 1972; both cited from memory) log-rank statistic, rho = 0 in the
 * Harrington-Fleming family, as R `survival::survdiff` computes it: at each
 * distinct event time t with n at risk and D events, group g contributes
 * E_g = D·n_g/n and the hypergeometric covariance
 * V_gh = D(n−D)/(n²(n−1))·n_g(δ_gh·n − n_h). With u = (O − E) for the first
 * k − 1 groups, χ² = uᵀV⁻¹u (solved by Gaussian elimination, see
 * `solveSymmetricPsd`) on k − 1 degrees of freedom; for k = 2 this is
 * (O₁ − E₁)²/V₁₁. No continuity correction. Not the shortcut Σ(O−E)²/E.
 * Ties: events at t are counted before censorings at t. Groups are reported
 * sorted by label. Degenerate case: if some group has nobody at risk at any
 * informative event time, the covariance matrix is singular; it is then
 * handled as a generalised inverse and `df` is its rank (less than k − 1).
 *
 * Cost: O(n) for one radix sort of all times with their group tags
 * (`tagSortedTimes`; O(n log n) below 2 048), O(n) for the sweep, O(E·k²)
 * for the expected counts and covariance at E distinct event times and
 * O(k³) for the solve; O(n) memory.
 *
 * @param obs - observations with `time` (finite, >= 0), `event` (boolean)
 *   and `group` (string). Not modified.
 * @throws RangeError when `obs` is empty or invalid, there are fewer than two
 *   groups, there are no events, or no event time has more than one group at
 *   risk (df would be 0).
 * @returns χ², df, p-value and per-group n, observed and expected events.
 * @example
 * logRank([...sixMp.map(o => ({ ...o, group: '6-MP' })), ...placebo.map(o => ({ ...o, group: 'placebo' }))]);
 * // { chiSquare: 16.79294, df: 1, pValue: 4.1688e-5, groups: [...] }
 */
export function logRank(obs: readonly GroupedObs[]): LogRankResult {
  const { labels, sizes, times, tags } = tagSortedTimes(obs, 'logRank');
  const k = labels.length;
  if (k < 2) throw new RangeError('logRank: at least two groups are required');
  const m = k - 1;
  const n = times.length;

  const atRisk = Float64Array.from(sizes);
  const d = new Float64Array(k);
  const c = new Float64Array(k);
  const touched = new Int32Array(k); // groups with an observation at the current time
  const observed = new Float64Array(k);
  const expected = new Float64Array(k);
  const cov = new Float64Array(m * m);

  let total = n;
  let i = 0;
  while (i < n) {
    const t = times[i];
    let events = 0;
    let nTouched = 0;
    while (i < n && times[i] === t) {
      const tag = tags[i] ?? 0;
      const g = tag >> 1;
      if (d[g] === 0 && c[g] === 0) touched[nTouched++] = g;
      if ((tag & 1) === 1) {
        d[g] = (d[g] ?? 0) + 1;
        events++;
      } else c[g] = (c[g] ?? 0) + 1;
      i++;
    }
    if (events > 0) {
      for (let g = 0; g < k; g++) expected[g] = (expected[g] ?? 0) + (events * (atRisk[g] ?? 0)) / total;
      if (total > 1 && events < total) {
        const w = (events * (total - events)) / (total * total * (total - 1));
        for (let g = 0; g < m; g++) {
          const ng = atRisk[g] ?? 0;
          if (ng === 0) continue;
          for (let h = 0; h < m; h++) {
            cov[g * m + h] = (cov[g * m + h] ?? 0) + w * ng * ((g === h ? total : 0) - (atRisk[h] ?? 0));
          }
        }
      }
    }
    // Events and censorings at t leave the risk set after t.
    for (let j = 0; j < nTouched; j++) {
      const g = touched[j] ?? 0;
      const dg = d[g] ?? 0;
      const removed = dg + (c[g] ?? 0);
      observed[g] = (observed[g] ?? 0) + dg;
      atRisk[g] = (atRisk[g] ?? 0) - removed;
      total -= removed;
      d[g] = 0;
      c[g] = 0;
    }
  }

  let totalEvents = 0;
  for (const o of observed) totalEvents += o;
  if (totalEvents === 0) throw new RangeError('logRank: there are no events, so groups cannot be compared');
  const u = new Float64Array(m);
  for (let g = 0; g < m; g++) u[g] = (observed[g] ?? 0) - (expected[g] ?? 0);
  const { solution, rank } = solveSymmetricPsd(cov, u);
  if (rank === 0) {
    throw new RangeError('logRank: no event time has more than one group at risk, so the test is not defined');
  }
  let chiSquare = 0;
  for (let g = 0; g < m; g++) chiSquare += (u[g] ?? 0) * (solution[g] ?? 0);
  if (chiSquare < 0) chiSquare = 0; // rounding guard; the quadratic form is >= 0
  return {
    chiSquare,
    df: rank,
    pValue: chiSquareUpperTail(chiSquare, rank),
    groups: labels.map((group, g) => ({
      group,
      n: sizes[g] ?? 0,
      observed: observed[g] ?? 0,
      expected: expected[g] ?? 0,
    })),
  };
}
