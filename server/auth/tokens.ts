import { createHash, randomBytes } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import type { AuthTokenPurpose } from '../../shared/account';
import { authTokens } from '../db/schema';
import { BadRequestError, HttpError } from '../errors';
import type { Tx } from '../services/audit';

/** How long an e-mailed link works. */
export const TOKEN_LIFETIME_MS: Record<AuthTokenPurpose, number> = {
  invite: 72 * 3_600_000,
  reset: 3_600_000,
};

export class GoneError extends HttpError {
  constructor(message: string) {
    super(410, message);
  }
}

const sha256 = (token: string) => createHash('sha256').update(token).digest('hex');

/**
 * Issues a new single-use token for `purpose`, retiring any earlier unused one of the same purpose
 * (so only the newest e-mail's link works). Returns the raw token, which is never stored.
 */
export async function issueToken(tx: Tx, userId: number, purpose: AuthTokenPurpose, now = new Date()) {
  await retireTokens(tx, userId, purpose, now);
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(now.getTime() + TOKEN_LIFETIME_MS[purpose]);
  await tx.insert(authTokens).values({ userId, purpose, tokenHash: sha256(token), expiresAt });
  return { token, expiresAt };
}

/** Marks every unused token of `purpose` (or of every purpose) of the user as used. */
export async function retireTokens(tx: Tx, userId: number, purpose?: AuthTokenPurpose, now = new Date()) {
  await tx
    .update(authTokens)
    .set({ usedAt: now })
    .where(
      and(
        eq(authTokens.userId, userId),
        isNull(authTokens.usedAt),
        purpose ? eq(authTokens.purpose, purpose) : undefined,
      ),
    );
}

/**
 * Uses a token once: 400 when unknown (typed wrong, tampered, other purpose), 410 when expired or
 * already used. The update is conditional, so two concurrent uses cannot both succeed.
 */
export async function consumeToken(tx: Tx, token: string, purpose: AuthTokenPurpose, now = new Date()) {
  const [row] = await tx
    .select()
    .from(authTokens)
    .where(and(eq(authTokens.tokenHash, sha256(token)), eq(authTokens.purpose, purpose)));
  if (!row) throw new BadRequestError('This link is not valid. Check that you copied all of it, or ask for a new one.');
  if (row.usedAt) throw new GoneError('This link has already been used. Ask for a new one if you still need it.');
  if (row.expiresAt.getTime() <= now.getTime()) throw new GoneError('This link has expired. Ask for a new one.');
  const [used] = await tx
    .update(authTokens)
    .set({ usedAt: now })
    .where(and(eq(authTokens.id, row.id), isNull(authTokens.usedAt)))
    .returning({ userId: authTokens.userId });
  if (!used) throw new GoneError('This link has already been used. Ask for a new one if you still need it.');
  return { userId: used.userId };
}
