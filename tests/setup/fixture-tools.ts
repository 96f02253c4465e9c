/** Small helpers shared by the invented test datasets. */

/** Deterministic pseudo-random numbers in [0, 1) (xorshift32; Marsaglia 2003, cited from memory). */
export function prng(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return s / 4294967296;
  };
}

/** An ISO calendar date `days` after `iso`. */
export const addDays = (iso: string, days: number) =>
  new Date(Date.parse(`${iso}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
