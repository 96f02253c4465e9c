import { expect } from 'vitest';

/**
 * Asserts agreement to `tol` (default 1e-6): absolute for |expected| <= 1,
 * relative above that. null and NaN must match exactly.
 */
export function expectClose(actual: number | null | undefined, expected: number | null, tol = 1e-6): void {
  if (expected === null) {
    expect(actual).toBeNull();
    return;
  }
  expect(typeof actual).toBe('number');
  const a = actual as number;
  const scale = Math.max(1, Math.abs(expected));
  if (Math.abs(a - expected) > tol * scale) {
    expect.fail(`expected ${a} to be within ${tol} (scaled by ${scale}) of ${expected}`);
  }
}
