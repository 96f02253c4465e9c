import { eq } from 'drizzle-orm';
import type { AcceptInvitationInput, Account, InvitationInput } from '../../shared/account';
import type { SessionUser } from '../../shared/auth';
import type { Role } from '../../shared/roles';
import type { Db } from '../db/client';
import { clinics, users } from '../db/schema';
import { scopeOf } from '../db/scope';
import { ConflictError, ForbiddenError, ValidationError } from '../errors';
import { hashPassword } from '../auth/passwords';
import { consumeToken, GoneError, issueToken, retireTokens } from '../auth/tokens';
import { audit } from './audit';
import { accountColumns, assertMayManage, findAccountInScope, toAccount } from './users.service';

/** Who may invite whom: stewards invite stewards, researchers and clinic leads; a lead invites clinicians. */
const MAY_INVITE: Record<Role, readonly Role[]> = {
  steward: ['steward', 'researcher', 'lead'],
  lead: ['clinician'],
  clinician: [],
  researcher: [],
};

export type Invitation = { account: Account; token: string; expiresAt: Date; clinicName: string | null };

async function clinicFor(db: Db, actor: SessionUser, input: InvitationInput) {
  const needsClinic = input.role === 'lead' || input.role === 'clinician';
  const clinicId = actor.role === 'lead' ? (input.clinicId ?? actor.clinicId) : (input.clinicId ?? null);
  if (!needsClinic) {
    if (clinicId != null)
      throw new ValidationError('Stewards and researchers belong to no clinic', [
        { path: ['clinicId'], message: 'Leave the clinic empty for this role' },
      ]);
    return null;
  }
  if (clinicId == null)
    throw new ValidationError('Choose the clinic', [
      { path: ['clinicId'], message: 'A clinic lead or clinician needs a clinic' },
    ]);
  if (actor.role === 'lead' && clinicId !== actor.clinicId)
    throw new ForbiddenError('A clinic lead invites clinicians of their own clinic only');
  const [clinic] = await db
    .select({ id: clinics.id, name: clinics.displayName, active: clinics.active })
    .from(clinics)
    .where(eq(clinics.id, clinicId));
  if (!clinic || !clinic.active)
    throw new ValidationError('No such clinic', [{ path: ['clinicId'], message: 'No active clinic with this id' }]);
  return clinic;
}

/** Creates the invited (password-less) account and its single-use link. The caller e-mails the token. */
export async function inviteAccount(db: Db, actor: SessionUser, input: InvitationInput): Promise<Invitation> {
  if (!MAY_INVITE[actor.role].includes(input.role)) {
    throw new ForbiddenError(
      actor.role === 'steward' ? "A clinic's lead invites its clinicians" : 'Your role cannot invite this role',
    );
  }
  const clinic = await clinicFor(db, actor, input);
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email));
  if (existing) throw new ConflictError('An account with this e-mail already exists; resend its invitation instead');
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(users)
      .values({ email: input.email, role: input.role, clinicId: clinic?.id ?? null })
      .returning(accountColumns);
    const { token, expiresAt } = await issueToken(tx, row!.id, 'invite');
    await audit(tx, {
      actorId: actor.id,
      clinicId: row!.clinicId,
      action: 'invite',
      entity: 'user',
      entityId: row!.id,
      detail: { role: input.role },
    });
    return { account: toAccount(row!), token, expiresAt, clinicName: clinic?.name ?? null };
  });
}

/** A new link for an invitation not yet accepted; the earlier link stops working. */
export async function resendInvitation(db: Db, actor: SessionUser, userId: number): Promise<Invitation> {
  const target = await findAccountInScope(db, scopeOf(actor), userId);
  assertMayManage(actor, target);
  if (!target.active) throw new ConflictError('This account is deactivated');
  if (target.passwordHash) throw new ConflictError('This invitation was already accepted');
  const [clinic] = target.clinicId
    ? await db.select({ name: clinics.displayName }).from(clinics).where(eq(clinics.id, target.clinicId))
    : [];
  return db.transaction(async (tx) => {
    const { token, expiresAt } = await issueToken(tx, userId, 'invite');
    await audit(tx, {
      actorId: actor.id,
      clinicId: target.clinicId,
      action: 'resend-invitation',
      entity: 'user',
      entityId: userId,
      detail: { role: target.role },
    });
    return { account: toAccount(target), token, expiresAt, clinicName: clinic?.name ?? null };
  });
}

/** Uses an invitation link: sets name and password. Returns the now active user, to be signed in. */
export async function acceptInvitation(db: Db, input: AcceptInvitationInput): Promise<SessionUser> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const { userId } = await consumeToken(tx, input.token, 'invite');
    const [target] = await tx.select(accountColumns).from(users).where(eq(users.id, userId));
    if (!target || !target.active) throw new GoneError('This invitation was withdrawn');
    if (target.passwordHash) throw new GoneError('This invitation was already accepted; sign in instead');
    const [row] = await tx
      .update(users)
      .set({ name: input.name, passwordHash })
      .where(eq(users.id, userId))
      .returning({ id: users.id, email: users.email, name: users.name, role: users.role, clinicId: users.clinicId });
    await retireTokens(tx, userId, 'invite');
    await audit(tx, {
      actorId: userId,
      clinicId: row!.clinicId,
      action: 'accept-invitation',
      entity: 'user',
      entityId: userId,
    });
    return row!;
  });
}
