import { eq } from 'drizzle-orm';
import { PreferencesPatchSchema, type Preferences } from '../../shared/schemas/follow-ups';
import type { Db } from '../db/client';
import { users } from '../db/schema';
import { NotFoundError } from '../errors';
import { audit } from './audit';

/** The caller's own preferences (only the reminder digest for now). */
export async function getPreferences(db: Db, userId: number): Promise<Preferences> {
  const [row] = await db.select({ digestOptOut: users.digestOptOut }).from(users).where(eq(users.id, userId));
  if (!row) throw new NotFoundError('No such account');
  return row;
}

/** PATCH /api/me/preferences: a user changes only their own row, audited. */
export async function updatePreferences(db: Db, userId: number, raw: unknown): Promise<Preferences> {
  const input = PreferencesPatchSchema.parse(raw);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(users)
      .set({ digestOptOut: input.digestOptOut })
      .where(eq(users.id, userId))
      .returning({ digestOptOut: users.digestOptOut, clinicId: users.clinicId });
    if (!row) throw new NotFoundError('No such account');
    await audit(tx, {
      actorId: userId,
      clinicId: row.clinicId,
      action: 'update',
      entity: 'user-preferences',
      entityId: userId,
      detail: { digestOptOut: row.digestOptOut },
    });
    return { digestOptOut: row.digestOptOut };
  });
}
