/** Leaf paths of a settings object, e.g. { 'recovery.threshold': 2, 'followUpWindows.week6.fromDay': 35 }. */
function flatten(value: unknown, prefix = '', out: Record<string, unknown> = {}): Record<string, unknown> {
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value)) flatten(v, prefix ? `${prefix}.${k}` : k, out);
  } else {
    out[prefix] = value;
  }
  return out;
}

export type RuleChange = { path: string; from: unknown; to: unknown };

/** The settings that differ between two rules records, in a stable order. */
export function diffRules(before: unknown, after: unknown): RuleChange[] {
  const a = flatten(before);
  const b = flatten(after);
  const paths = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
  return paths
    .filter((p) => JSON.stringify(a[p]) !== JSON.stringify(b[p]))
    .map((path) => ({ path, from: a[path] ?? null, to: b[path] ?? null }));
}
