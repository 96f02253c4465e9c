/**
 * Benjamini-Hochberg adjusted p-values.
 *
 * Step-up false-discovery-rate adjustment of Benjamini & Hochberg (1995,
 * J R Stat Soc B 57:289–300): with the m p-values sorted ascending, the
 * adjusted value of p₍ᵢ₎ is min over j >= i of min(1, m·p₍ⱼ₎/j). Rejecting
 * every hypothesis whose adjusted value is <= q controls the FDR at q. Same
 * as R `p.adjust(method = "BH")` and scipy `false_discovery_control`. Ties
 * are handled naturally (tied p-values get the same adjusted value).
 *
 * Cost: O(m log m) time, O(m) memory.
 *
 * @param pValues - p-values, each finite and in [0, 1]. Not modified. May be empty.
 * @throws RangeError when a value is not a finite number in [0, 1].
 * @returns adjusted p-values in the order given.
 * @example
 * benjaminiHochberg([0.01, 0.04, 0.03]); // [0.03, 0.04, 0.04]
 */
export function benjaminiHochberg(pValues: readonly number[]): number[] {
  const m = pValues.length;
  pValues.forEach((p, i) => {
    if (typeof p !== 'number' || !Number.isFinite(p) || p < 0 || p > 1) {
      throw new RangeError(`benjaminiHochberg: pValues[${i}] must be a number in [0, 1], got ${String(p)}`);
    }
  });
  const order = Array.from({ length: m }, (_, i) => i).sort((a, b) => (pValues[a] ?? 0) - (pValues[b] ?? 0));
  const adjusted = new Array<number>(m).fill(1);
  let running = 1;
  for (let rank = m; rank >= 1; rank--) {
    const idx = order[rank - 1] ?? 0;
    const p = pValues[idx] ?? 1;
    // m·p/rank >= p in exact arithmetic; max() keeps that true after rounding.
    const candidate = Math.max(p, (p * m) / rank);
    if (candidate < running) running = candidate;
    adjusted[idx] = running;
  }
  return adjusted;
}
