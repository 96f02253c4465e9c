/** Radix sort digits: four 16-bit digits of a double's 64-bit pattern, least significant first. */
export const RADIX_BITS = 16;
export const RADIX_BUCKETS = 1 << RADIX_BITS;
export const RADIX_MASK = RADIX_BUCKETS - 1;
/** Below this length a comparison sort beats the radix passes. */
export const RADIX_MIN_LENGTH = 65536;
/** The digit passes read the two 32-bit words of a double in little-endian order. */
export const LITTLE_ENDIAN = new Uint8Array(Float64Array.of(1).buffer)[7] === 0x3f;

/**
 * Histograms of all four 16-bit digits of `n` doubles, in one sweep.
 *
 * Shared by the two radix sorts (`sortNonNegative`, `sortTagged`). `words` is
 * the doubles' buffer read as 2n unsigned 32-bit words (little-endian).
 *
 * Cost: O(n) time, 1 MiB for the counts.
 *
 * @param words - the doubles as 32-bit words, low word first.
 * @param n - number of doubles.
 * @throws never.
 * @returns counts: digit d of pass p at index p·65536 + d.
 * @example
 * digitHistograms(new Uint32Array(Float64Array.of(1, 2).buffer), 2)[3 * 65536 + 0x3ff0]; // 1
 */
export function digitHistograms(words: Uint32Array, n: number): Uint32Array {
  const counts = new Uint32Array(4 * RADIX_BUCKETS);
  for (let i = 0; i < n; i++) {
    const lo = words[2 * i] ?? 0;
    const hi = words[2 * i + 1] ?? 0;
    const b0 = lo & RADIX_MASK;
    const b1 = RADIX_BUCKETS + (lo >>> RADIX_BITS);
    const b2 = 2 * RADIX_BUCKETS + (hi & RADIX_MASK);
    const b3 = 3 * RADIX_BUCKETS + (hi >>> RADIX_BITS);
    counts[b0] = (counts[b0] ?? 0) + 1;
    counts[b1] = (counts[b1] ?? 0) + 1;
    counts[b2] = (counts[b2] ?? 0) + 1;
    counts[b3] = (counts[b3] ?? 0) + 1;
  }
  return counts;
}

/**
 * Start offsets of each bucket for one pass, written into `offsets`.
 *
 * Cost: O(65 536).
 *
 * @param counts - the histograms from {@link digitHistograms}.
 * @param pass - 0…3.
 * @param n - number of doubles.
 * @param offsets - receives the running sums.
 * @throws never.
 * @returns false when every value has the same digit in this pass (the pass can be skipped).
 * @example
 * if (bucketOffsets(counts, 0, n, offsets)) { ... move the values ... }
 */
export function bucketOffsets(counts: Uint32Array, pass: number, n: number, offsets: Uint32Array): boolean {
  const base = pass * RADIX_BUCKETS;
  let sum = 0;
  let needed = true;
  for (let b = 0; b < RADIX_BUCKETS; b++) {
    const c = counts[base + b] ?? 0;
    if (c === n) needed = false;
    offsets[b] = sum;
    sum += c;
  }
  return needed;
}
