/** Tolerance for "the curve equals exactly 0.5". */
export const MEDIAN_TOLERANCE = 1e-12;

/**
 * Streaming median of a step curve.
 *
 * Fed the values of one Kaplan-Meier column (survival, lower or upper bound)
 * in time order, it finds the first time at which the curve is <= 0.5. When
 * the value there equals 0.5 (within 1e-12) the curve is flat at exactly one
 * half and the median is the midpoint between that time and the next time at
 * which the curve falls below 0.5; if it never does, the time itself. This is
 * the rule printed by R `survival::print.survfit` (survival 3.5). Applied to
 * the lower and upper bound columns it gives the limits of the median's
 * confidence interval. `null`/NaN values (undefined bounds, e.g. where S = 0)
 * never count as reaching 0.5. Working during the Kaplan-Meier sweep avoids
 * extra passes over a large table; only steps where the curve changes need
 * to be fed.
 *
 * Cost: O(1) per update.
 *
 * @throws never.
 * @example
 * const m = new MedianTracker();
 * m.update(5, 0.5); m.update(9, 1 / 3);
 * m.result(); // 7
 */
export class MedianTracker {
  private found: number | null = null;
  private pendingTime = NaN;

  /**
   * Feeds the curve's value at `time` (times must not decrease).
   * @param time - the step's time.
   * @param value - the curve's value from this time on; null or NaN = undefined.
   * @throws never.
   * @returns nothing.
   */
  update(time: number, value: number | null): void {
    if (this.found !== null || value === null || Number.isNaN(value)) return;
    if (!Number.isNaN(this.pendingTime)) {
      if (value < 0.5 - MEDIAN_TOLERANCE) this.found = (this.pendingTime + time) / 2;
      return;
    }
    if (value > 0.5 + MEDIAN_TOLERANCE) return;
    if (Math.abs(value - 0.5) <= MEDIAN_TOLERANCE) this.pendingTime = time;
    else this.found = time;
  }

  /**
   * The median so far.
   * @returns the median time, or null when the curve never reached 0.5.
   */
  result(): number | null {
    if (this.found !== null) return this.found;
    return Number.isNaN(this.pendingTime) ? null : this.pendingTime;
  }
}
