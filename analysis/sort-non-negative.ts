/** Below this length the native sort is faster than the radix passes. */
const RADIX_MIN_LENGTH = 65536;
const BITS = 16;
const BUCKETS = 1 << BITS;
const MASK = BUCKETS - 1;
const LITTLE_ENDIAN = new Uint8Array(Float64Array.of(1).buffer)[7] === 0x3f;

/**
 * In-place ascending sort of non-negative doubles.
 *
 * For non-negative IEEE-754 doubles the 64-bit pattern read as an unsigned
 * integer has the same order as the numbers, so a least-significant-digit
 * radix sort (Knuth, TAOCP vol. 3, §5.2.5, cited from memory) on four 16-bit digits sorts them
 * in linear time. All four digit histograms are built in one pass, and a
 * pass is skipped when every value has the same digit (e.g. the low bits of
 * whole-week times). Short arrays, and big-endian platforms, use the native
 * `Float64Array` sort instead. The result is identical to
 * `Float64Array.prototype.sort` for such input.
 *
 * Cost: O(n) time (at most 5 sweeps of the data), O(n) scratch memory plus
 * 1 MiB of histograms.
 *
 * @param values - finite values >= 0 with no negative zero (-0 would sort
 *   last); may be a subarray view. Sorted in place.
 * @throws never (input is not checked; callers validate).
 * @returns the same array, sorted.
 * @example
 * sortNonNegative(Float64Array.of(3, 0.5, 2)); // Float64Array [0.5, 2, 3]
 */
export function sortNonNegative(values: Float64Array): Float64Array {
  const n = values.length;
  if (n < RADIX_MIN_LENGTH || !LITTLE_ENDIAN) return values.sort();
  const counts = new Uint32Array(4 * BUCKETS);
  const words = new Uint32Array(values.buffer, values.byteOffset, 2 * n);
  for (let i = 0; i < n; i++) {
    const lo = words[2 * i] ?? 0;
    const hi = words[2 * i + 1] ?? 0;
    const b0 = lo & MASK;
    const b1 = BUCKETS + (lo >>> BITS);
    const b2 = 2 * BUCKETS + (hi & MASK);
    const b3 = 3 * BUCKETS + (hi >>> BITS);
    counts[b0] = (counts[b0] ?? 0) + 1;
    counts[b1] = (counts[b1] ?? 0) + 1;
    counts[b2] = (counts[b2] ?? 0) + 1;
    counts[b3] = (counts[b3] ?? 0) + 1;
  }
  let src: Float64Array = values;
  let srcWords: Uint32Array = words;
  let dst: Float64Array = new Float64Array(n);
  let dstWords: Uint32Array = new Uint32Array(dst.buffer, dst.byteOffset, 2 * n);
  const offsets = new Uint32Array(BUCKETS);
  for (let pass = 0; pass < 4; pass++) {
    const base = pass * BUCKETS;
    let sum = 0;
    let skip = false;
    for (let b = 0; b < BUCKETS; b++) {
      const c = counts[base + b] ?? 0;
      if (c === n) skip = true;
      offsets[b] = sum;
      sum += c;
    }
    if (skip) continue;
    const wordIndex = pass >> 1; // passes 0, 1 read the low word; 2, 3 the high word
    const shift = (pass & 1) * BITS;
    for (let i = 0; i < n; i++) {
      const digit = ((srcWords[2 * i + wordIndex] ?? 0) >>> shift) & MASK;
      const pos = offsets[digit] ?? 0;
      offsets[digit] = pos + 1;
      dst[pos] = src[i] ?? 0;
    }
    const t = src;
    src = dst;
    dst = t;
    const tw = srcWords;
    srcWords = dstWords;
    dstWords = tw;
  }
  if (src !== values) values.set(src);
  return values;
}
