import { eq } from 'drizzle-orm';
import type { SessionUser } from '../../shared/auth';
import type { Db } from '../db/client';
import { users } from '../db/schema';
import { verifyPassword } from './passwords';

const sessionColumns = { id: users.id, email: users.email, name: users.name, role: users.role, clinicId: users.clinicId };

/** The signed-in user as the session sees it, or null when gone or deactivated. */
export async function findActiveUser(db: Db, id: number): Promise<SessionUser | null> {
  const [row] = await db.select({ ...sessionColumns, active: users.active }).from(users).where(eq(users.id, id));
  if (!row || !row.active) return null;
  const { active: _active, ...user } = row;
  return user;
}

/** Checks e-mail and password; the same answer (null) for an unknown e-mail, a wrong password or a deactivated user. */
export async function authenticate(db: Db, email: string, password: string): Promise<SessionUser | null> {
  const [row] = await db
    .select({ ...sessionColumns, active: users.active, passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.email, email.trim().toLowerCase()));
  const ok = await verifyPassword(row?.passwordHash, password);
  if (!row || !ok || !row.active) return null;
  const { active: _a, passwordHash: _p, ...user } = row;
  return user;
}
