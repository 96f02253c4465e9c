import { and, asc, eq, type SQL } from 'drizzle-orm';
import type { Account } from '../../shared/account';
import type { SessionUser } from '../../shared/auth';
import type { Db } from '../db/client';
import { users } from '../db/schema';
import { scopeOf, type Scope } from '../db/scope';
import { ForbiddenError, NotFoundError } from '../errors';
import { endAllSessions } from '../auth/session';
import { retireTokens } from '../auth/tokens';
import { audit } from './audit';

/** The columns of an account as managers see it (never the password hash). */
export const accountColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  clinicId: users.clinicId,
  active: users.active,
  passwordHash: users.passwordHash,
};
type AccountRow = { [K in keyof typeof accountColumns]: (typeof users.$inferSelect)[K] };

export function toAccount(row: AccountRow): Account {
  const state = !row.active ? 'deactivated' : row.passwordHash ? 'active' : 'invited';
  return { id: row.id, email: row.email, name: row.name, role: row.role, clinicId: row.clinicId, state };
}

/** Accounts a scope may see: a clinic scope only its clinic's people; the registry scope everyone. */
function accountsVisibleTo(scope: Scope): SQL | undefined {
  return scope.kind === 'clinic' ? eq(users.clinicId, scope.clinicId) : undefined;
}

export async function listAccounts(db: Db, scope: Scope): Promise<Account[]> {
  const rows = await db
    .select(accountColumns)
    .from(users)
    .where(accountsVisibleTo(scope))
    .orderBy(asc(users.role), asc(users.email));
  return rows.map(toAccount);
}

/** One account in the caller's scope; another clinic's account is "not found", never "forbidden". */
export async function findAccountInScope(db: Db, scope: Scope, id: number): Promise<AccountRow> {
  const [row] = await db
    .select(accountColumns)
    .from(users)
    .where(and(eq(users.id, id), accountsVisibleTo(scope)));
  if (!row) throw new NotFoundError('No such account');
  return row;
}

/** Stewards manage every account; a lead manages only the clinicians of their clinic. */
export function assertMayManage(actor: SessionUser, target: { role: string; id: number }): void {
  if (actor.role === 'steward') return;
  if (actor.role === 'lead' && target.role === 'clinician') return;
  throw new ForbiddenError('A clinic lead manages only the clinicians of their clinic');
}

/** Deactivates an account: it can no longer sign in, its open links stop working and its sessions end. */
export async function deactivateAccount(db: Db, actor: SessionUser, id: number): Promise<Account> {
  const target = await findAccountInScope(db, scopeOf(actor), id);
  if (target.id === actor.id) throw new ForbiddenError('You cannot deactivate your own account');
  assertMayManage(actor, target);
  if (!target.active) return toAccount(target);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(users)
      .set({ active: false, deactivatedAt: new Date() })
      .where(eq(users.id, id))
      .returning(accountColumns);
    await retireTokens(tx, id);
    await endAllSessions(tx, id);
    await audit(tx, {
      actorId: actor.id,
      clinicId: target.clinicId,
      action: 'deactivate',
      entity: 'user',
      entityId: id,
      detail: { role: target.role },
    });
    return toAccount(row!);
  });
}
