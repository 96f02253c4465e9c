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
 * In-place ascending sort of non-negative doubles that carries a tag along.
 *
 * The same least-significant-digit radix sort as {@link sortNonNegative}
 * (the bit pattern of a non-negative double orders like the number; Knuth,
 * TAOCP vol. 3, §5.2.5, cited from memory), except that every move of a
 * value also moves `tags[i]`, so after the sort `tags[i]` still belongs to
 * `values[i]`. The radix passes are stable; the short-array path (a
 * comparison sort of indices) is stable too, so equal values keep their
 * input order in both cases. Callers that need only the values use
 * `sortNonNegative`, which skips the tag traffic.
 *
 * Cost: O(n) time (at most 7 sweeps), O(n) scratch (12 bytes per value) plus
 * 48 KiB of histograms; O(n log n) below 2,048 values.
 *
 * @param values - finite values >= 0 without negative zero. Sorted in place.
 * @param tags - one tag per value (same length). Permuted in place.
 * @throws RangeError when the two arrays differ in length.
 * @returns nothing; both arrays are reordered.
 * @example
 * const v = Float64Array.of(3, 1, 2);
 * const t = Int32Array.of(30, 10, 20);
 * sortTagged(v, t); // v = [1, 2, 3], t = [10, 20, 30]
 */
export function sortTagged(values: Float64Array, tags: Int32Array): void {
  const n = values.length;
  if (tags.length !== n) throw new RangeError('sortTagged: values and tags must have the same length');
  if (n < RADIX_MIN_LENGTH || !LITTLE_ENDIAN) {
    sortByIndex(values, tags);
    return;
  }
  const words = new Uint32Array(values.buffer, values.byteOffset, 2 * n);
  const counts = digitHistograms(words, n);
  let src: Float64Array = values;
  let srcTags: Int32Array = tags;
  let srcWords: Uint32Array = words;
  let dst: Float64Array = new Float64Array(n);
  let dstTags: Int32Array = new Int32Array(n);
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
      dstTags[pos] = srcTags[i] ?? 0;
    }
    [src, dst] = [dst, src];
    [srcTags, dstTags] = [dstTags, srcTags];
    [srcWords, dstWords] = [dstWords, srcWords];
  }
  if (src !== values) {
    values.set(src);
    tags.set(srcTags);
  }
}

/** Stable comparison sort of both arrays by value, through an index permutation. */
function sortByIndex(values: Float64Array, tags: Int32Array): void {
  const n = values.length;
  const order = Array.from({ length: n }, (_, i) => i);
  order.sort((a, b) => (values[a] ?? 0) - (values[b] ?? 0) || a - b);
  const v = values.slice();
  const t = tags.slice();
  for (let i = 0; i < n; i++) {
    const from = order[i] ?? 0;
    values[i] = v[from] ?? 0;
    tags[i] = t[from] ?? 0;
  }
}

