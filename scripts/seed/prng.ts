/**
 * A small seeded pseudo-random generator for the invented demo data (mulberry32: 32-bit state,
 * fast, good enough for simulation, not for anything secret). The same seed gives the same registry.
 */
export class Prng {
  private state: number;

  constructor(seed: number) {
    this.state = seed >>> 0 || 0x9e3779b9;
  }

  /** Uniform in [0, 1). */
  next(): number {
    let t = (this.state = (this.state + 0x6d2b79f5) >>> 0);
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }

  chance(p: number): boolean {
    return this.next() < p;
  }

  int(min: number, max: number): number {
    return min + Math.floor(this.next() * (max - min + 1));
  }

  /** Standard normal by Box–Muller. */
  normal(mean = 0, sd = 1): number {
    const u = 1 - this.next();
    const v = this.next();
    return mean + sd * Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }

  /** A value whose logarithm is normal: median `median`, spread `sigma` on the log scale. */
  logNormal(median: number, sigma: number): number {
    return median * Math.exp(this.normal(0, sigma));
  }

  /** Poisson by Knuth's multiplication method (small means only). */
  poisson(mean: number): number {
    const limit = Math.exp(-mean);
    let k = 0;
    for (let p = this.next(); p > limit; p *= this.next()) k++;
    return k;
  }

  /** One of `items` with the given weights. */
  weighted<T>(items: readonly T[], weights: readonly number[]): T {
    const total = weights.reduce((a, b) => a + b, 0);
    let x = this.next() * total;
    for (let i = 0; i < items.length; i++) {
      x -= weights[i]!;
      if (x < 0) return items[i]!;
    }
    return items[items.length - 1]!;
  }
}

export const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
