import { and, eq, isNotNull } from 'drizzle-orm';
import type { ResetInput } from '../../shared/account';
import type { Db } from '../db/client';
import { users } from '../db/schema';
import { audit } from '../services/audit';
import { hashPassword } from './passwords';
import { endAllSessions } from './session';
import { consumeToken, GoneError, issueToken, retireTokens } from './tokens';

/**
 * A reset link for an active account that has a password; null for anything else (unknown e-mail,
 * deactivated, invitation pending) — the caller answers the same either way.
 */
export async function requestReset(db: Db, email: string): Promise<{ to: string; token: string } | null> {
  const [row] = await db
    .select({ id: users.id, email: users.email, clinicId: users.clinicId })
    .from(users)
    .where(and(eq(users.email, email), eq(users.active, true), isNotNull(users.passwordHash)));
  if (!row) return null;
  return db.transaction(async (tx) => {
    const { token } = await issueToken(tx, row.id, 'reset');
    await audit(tx, {
      actorId: row.id,
      clinicId: row.clinicId,
      action: 'request-reset',
      entity: 'user',
      entityId: row.id,
    });
    return { to: row.email, token };
  });
}

/** Sets the new password from a reset link and signs the account out everywhere. */
export async function resetPassword(db: Db, input: ResetInput): Promise<void> {
  const passwordHash = await hashPassword(input.password);
  await db.transaction(async (tx) => {
    const { userId } = await consumeToken(tx, input.token, 'reset');
    const [row] = await tx
      .update(users)
      .set({ passwordHash })
      .where(and(eq(users.id, userId), eq(users.active, true)))
      .returning({ id: users.id, clinicId: users.clinicId });
    if (!row) throw new GoneError('This account is deactivated');
    await retireTokens(tx, userId, 'reset');
    await endAllSessions(tx, userId);
    await audit(tx, {
      actorId: userId,
      clinicId: row.clinicId,
      action: 'reset-password',
      entity: 'user',
      entityId: userId,
    });
  });
}
