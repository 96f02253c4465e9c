import { and, eq, type SQL } from 'drizzle-orm';
import type { Scope } from '../db/scope';
import { episodes } from '../db/schema';
import { ForbiddenError, NotFoundError } from '../errors';
import type { Tx } from './audit';

/**
 * Clinic isolation for episode data, in one place. Lead and clinician see their own clinic; the steward
 * sees every clinic (optionally one); researchers never reach episode rows through these services.
 */
export function episodeScopeCondition(scope: Scope, clinicId?: number): SQL | undefined {
  if (scope.kind === 'clinic') return eq(episodes.clinicId, scope.clinicId);
  if (scope.researcher) throw new ForbiddenError('Researchers work with cohorts and exports, not episode records');
  return clinicId === undefined ? undefined : eq(episodes.clinicId, clinicId);
}

/** The clinic a caller writes for: only lead and clinician write episodes, and only for their own clinic. */
export function writableClinic(scope: Scope): number {
  if (scope.kind !== 'clinic') throw new ForbiddenError('Only the clinic’s lead and clinicians record episodes');
  return scope.clinicId;
}

/** The episode row when the caller may see it; another clinic's id is a 404, so existence does not leak. */
export async function episodeInScope(tx: Tx, scope: Scope, id: number, forUpdate = false) {
  const q = tx.select().from(episodes).where(and(eq(episodes.id, id), episodeScopeCondition(scope)));
  const [row] = forUpdate ? await q.for('update') : await q;
  if (!row) throw new NotFoundError('No such episode');
  return row;
}

/** The PostgreSQL error code of a failed query (drizzle wraps the driver's error in `cause`). */
export function pgCode(err: unknown): string | undefined {
  for (let e: unknown = err, i = 0; e && i < 5; e = (e as { cause?: unknown }).cause, i++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && /^[0-9A-Z]{5}$/.test(code)) return code;
  }
  return undefined;
}

/** Parses a route's `:id` (a positive integer) or answers 404 as for an unknown episode. */
export function episodeId(raw: unknown): number {
  if (typeof raw !== 'string' || !/^\d+$/.test(raw)) throw new NotFoundError('No such episode');
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1 || n > 2_147_483_647) throw new NotFoundError('No such episode');
  return n;
}
