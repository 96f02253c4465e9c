/**
 * Stratum key for Mantel-Haenszel estimates.
 *
 * Joins the stratifying values of an episode, e.g. activity profile and
 * symptom-duration band, into one key ("active × 3-12m"). Returns null when
 * any part is missing, so the episode is counted as "stratum unknown" rather
 * than pooled into a wrong stratum.
 *
 * Cost: O(k) for k parts.
 *
 * @param parts - stratifying values; null, undefined or '' mean missing.
 * @throws never.
 * @returns the key, or null.
 * @example
 * stratumKey('active', '3-12m'); // 'active × 3-12m'
 * stratumKey('active', null);    // null
 */
export function stratumKey(...parts: readonly (string | null | undefined)[]): string | null {
  if (parts.length === 0) return null;
  const clean: string[] = [];
  for (const p of parts) {
    if (p === null || p === undefined || p === '') return null;
    clean.push(p);
  }
  return clean.join(' × ');
}
