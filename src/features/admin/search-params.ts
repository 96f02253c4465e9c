/** A query string from an object; undefined and empty values are left out so links stay plain. */
export function searchOf(q: Record<string, string | number | boolean | undefined>): string {
  const sp = new URLSearchParams();
  for (const [k, v] of Object.entries(q)) if (v !== undefined && v !== '') sp.set(k, String(v));
  return sp.toString();
}
