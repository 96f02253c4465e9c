import type { GroupedObs, LogRankResult } from './types';
import { groupSortedTimes } from './group-sorted-times';
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
 * Cost: O(n) for the per-group radix sorts (O(n log n) for small groups),
 * O(T·k) for the sweep over T distinct times, O(E·k²) for the covariance at
 * E event times and O(k³) for the solve; O(n) memory.
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
  const { labels, sizes, eventTimes, eventStart, censorTimes, censorStart } = groupSortedTimes(obs, 'logRank');
  const k = labels.length;
  if (k < 2) throw new RangeError('logRank: at least two groups are required');
  const m = k - 1;

  const atRisk = Float64Array.from(sizes);
  const pe = eventStart.slice(0, k);
  const pc = censorStart.slice(0, k);
  // Current head (smallest unvisited time) of each group's two sorted blocks; Infinity when done.
  const headE = new Float64Array(k);
  const headC = new Float64Array(k);
  for (let g = 0; g < k; g++) {
    headE[g] = (pe[g] ?? 0) < (eventStart[g + 1] ?? 0) ? (eventTimes[pe[g] ?? 0] ?? Infinity) : Infinity;
    headC[g] = (pc[g] ?? 0) < (censorStart[g + 1] ?? 0) ? (censorTimes[pc[g] ?? 0] ?? Infinity) : Infinity;
  }
  const d = new Float64Array(k);
  const c = new Float64Array(k);
  const observed = new Float64Array(k);
  const expected = new Float64Array(k);
  const cov = new Float64Array(m * m);

  let total = obs.length;
  while (total > 0) {
    let t = Infinity;
    for (let g = 0; g < k; g++) {
      const he = headE[g] ?? Infinity;
      const hc = headC[g] ?? Infinity;
      if (he < t) t = he;
      if (hc < t) t = hc;
    }
    let events = 0;
    for (let g = 0; g < k; g++) {
      let dg = 0;
      if (headE[g] === t) {
        let p = pe[g] ?? 0;
        const end = eventStart[g + 1] ?? 0;
        while (p < end && eventTimes[p] === t) p++;
        dg = p - (pe[g] ?? 0);
        pe[g] = p;
        headE[g] = p < end ? (eventTimes[p] ?? Infinity) : Infinity;
      }
      let cg = 0;
      if (headC[g] === t) {
        let q = pc[g] ?? 0;
        const end = censorStart[g + 1] ?? 0;
        while (q < end && censorTimes[q] === t) q++;
        cg = q - (pc[g] ?? 0);
        pc[g] = q;
        headC[g] = q < end ? (censorTimes[q] ?? Infinity) : Infinity;
      }
      d[g] = dg;
      c[g] = cg;
      events += dg;
    }
    if (events > 0) {
      for (let g = 0; g < k; g++) {
        observed[g] = (observed[g] ?? 0) + (d[g] ?? 0);
        expected[g] = (expected[g] ?? 0) + (events * (atRisk[g] ?? 0)) / total;
      }
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
    for (let g = 0; g < k; g++) {
      const removed = (d[g] ?? 0) + (c[g] ?? 0);
      atRisk[g] = (atRisk[g] ?? 0) - removed;
      total -= removed;
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
