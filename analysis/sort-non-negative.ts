import {
  bucketOffsets,
  digitHistograms,
  LITTLE_ENDIAN,
  PASS_MASK,
  PASS_SHIFT,
  PASS_WORD,
  RADIX_BUCKETS,
  RADIX_MIN_LENGTH,
  RADIX_PASSES,
} from './radix-digits';

/**
 * In-place ascending sort of non-negative doubles.
 *
 * For non-negative IEEE-754 doubles the 64-bit pattern read as an unsigned
 * integer has the same order as the numbers, so a least-significant-digit
 * radix sort (Knuth, TAOCP vol. 3, §5.2.5, cited from memory) on six digits of 10–11 bits
 * (`radix-digits.ts`) sorts them in linear time. All six digit histograms are built in one pass, and a
 * pass is skipped when every value has the same digit (e.g. the low bits of
 * whole-week times). Short arrays, and big-endian platforms, use the native
 * `Float64Array` sort instead. The result is identical to
 * `Float64Array.prototype.sort` for such input.
 *
 * Cost: O(n) time (at most 7 sweeps of the data), O(n) scratch memory plus
 * 48 KiB of histograms; O(n log n) below 2,048 values.
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
  const words = new Uint32Array(values.buffer, values.byteOffset, 2 * n);
  const counts = digitHistograms(words, n);
  let src: Float64Array = values;
  let srcWords: Uint32Array = words;
  let dst: Float64Array = new Float64Array(n);
  let dstWords: Uint32Array = new Uint32Array(dst.buffer, dst.byteOffset, 2 * n);
  const offsets = new Uint32Array(RADIX_BUCKETS);
  for (let pass = 0; pass < RADIX_PASSES; pass++) {
    if (!bucketOffsets(counts, pass, n, offsets)) continue;
    const wordIndex = PASS_WORD[pass] ?? 0;
    const shift = PASS_SHIFT[pass] ?? 0;
    const mask = PASS_MASK[pass] ?? 0;
    for (let i = 0; i < n; i++) {
      const digit = ((srcWords[2 * i + wordIndex] ?? 0) >>> shift) & mask;
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
