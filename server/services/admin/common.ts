import type { Scope } from '../../db/scope';
import { ForbiddenError } from '../../errors';

/** The PostgreSQL error code of `err` or of the error it wraps (drizzle wraps driver errors). */
export function pgCode(err: unknown): string | undefined {
  for (let e: unknown = err, i = 0; e && i < 4; e = (e as { cause?: unknown }).cause, i++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string') return code;
  }
  return undefined;
}

export const isUniqueViolation = (err: unknown) => pgCode(err) === '23505';

/** Steward-only services check it too, so a route mounted without its role guard still refuses. */
export function assertSteward(scope: Scope): asserts scope is Extract<Scope, { kind: 'registry' }> {
  if (scope.kind !== 'registry' || scope.researcher) throw new ForbiddenError('Only the registry steward can do this');
}

/** The fields whose value differs, as { field: { from, to } } for the audit detail. */
export function changesOf<T extends Record<string, unknown>>(before: T, patch: Partial<T>): Record<string, { from: unknown; to: unknown }> {
  const out: Record<string, { from: unknown; to: unknown }> = {};
  for (const [k, to] of Object.entries(patch)) {
    if (to !== undefined && before[k] !== to) out[k] = { from: before[k], to };
  }
  return out;
}

export const iso = (d: Date | string | null | undefined): string | null =>
  d == null ? null : typeof d === 'string' ? new Date(d).toISOString() : d.toISOString();
