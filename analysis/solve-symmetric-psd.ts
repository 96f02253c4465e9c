/**
 * Linear solve for a symmetric positive semi-definite matrix.
 *
 * Solves A·x = b by Gaussian elimination without row exchanges, which is
 * stable for symmetric positive (semi-)definite A (Golub & Van Loan, Matrix
 * Computations, §4.2; cited from memory). A pivot that is not larger than `tolerance` times the
 * largest diagonal entry is treated as zero: for a PSD matrix its whole
 * remaining row and column are then zero, the unknown is set to 0 and the rank
 * drops by one. The result is a generalised-inverse solution, so xᵀb is the
 * quadratic form bᵀA⁻b whenever b lies in the column space of A, as it does
 * for the log-rank score vector. Used by `logRank` for k > 2 groups.
 *
 * Cost: O(m³) time, O(m²) memory for an m×m matrix.
 *
 * @param matrix - A in row-major order, length m·m; symmetric PSD. Not modified.
 * @param rhs - b, length m. Not modified.
 * @param tolerance - relative pivot tolerance, default 1e-10.
 * @throws RangeError when the lengths do not match or an entry is not finite.
 * @returns `{ solution, rank }`.
 * @example
 * solveSymmetricPsd(Float64Array.of(4, 2, 2, 3), Float64Array.of(2, 1)).solution; // [0.5, 0]
 */
export function solveSymmetricPsd(
  matrix: Float64Array,
  rhs: Float64Array,
  tolerance = 1e-10,
): { solution: Float64Array; rank: number } {
  const m = rhs.length;
  if (matrix.length !== m * m)
    throw new RangeError('solveSymmetricPsd: matrix must be m×m for a right-hand side of length m');
  for (const v of matrix)
    if (!Number.isFinite(v)) throw new RangeError('solveSymmetricPsd: matrix entries must be finite');
  for (const v of rhs)
    if (!Number.isFinite(v)) throw new RangeError('solveSymmetricPsd: right-hand side must be finite');
  const a = matrix.slice();
  const y = rhs.slice();
  let scale = 0;
  for (let p = 0; p < m; p++) scale = Math.max(scale, Math.abs(a[p * m + p] ?? 0));
  const skipped = new Uint8Array(m);
  let rank = 0;
  for (let p = 0; p < m; p++) {
    const pivot = a[p * m + p] ?? 0;
    if (!(pivot > tolerance * scale)) {
      skipped[p] = 1;
      continue;
    }
    rank++;
    for (let r = p + 1; r < m; r++) {
      const f = (a[r * m + p] ?? 0) / pivot;
      if (f === 0) continue;
      for (let c = p; c < m; c++) a[r * m + c] = (a[r * m + c] ?? 0) - f * (a[p * m + c] ?? 0);
      y[r] = (y[r] ?? 0) - f * (y[p] ?? 0);
    }
  }
  const x = new Float64Array(m);
  for (let p = m - 1; p >= 0; p--) {
    if (skipped[p] === 1) continue;
    let s = y[p] ?? 0;
    for (let c = p + 1; c < m; c++) s -= (a[p * m + c] ?? 0) * (x[c] ?? 0);
    x[p] = s / (a[p * m + p] ?? 1);
  }
  return { solution: x, rank };
}
