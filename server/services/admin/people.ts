import { and, asc, count, eq, ilike, isNotNull, isNull, or, sql, type SQL } from 'drizzle-orm';
import type { Person, PeopleQuery, PersonPatch } from '../../../shared/schemas/admin';
import { CLINIC_ROLES } from '../../../shared/roles';
import type { Db } from '../../db/client';
import { clinics, users } from '../../db/schema';
import type { Scope } from '../../db/scope';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../../errors';
import { audit } from '../audit';
import { assertSteward, changesOf, iso } from './common';

/**
 * The people screen's list. Invitations, resending and deactivation belong to the sign-in work
 * (POST /api/invitations, /api/invitations/:id/resend, /api/users/:id/deactivate); this adds the
 * filtered, paged list and the steward's change of role or clinic.
 */

/** Steward: everyone. Lead: the clinicians of their own clinic, nobody else. */
function visibleTo(scope: Scope): SQL | undefined {
  if (scope.kind === 'clinic') return and(eq(users.clinicId, scope.clinicId), eq(users.role, 'clinician'));
  assertSteward(scope);
  return undefined;
}

const statusCondition = (s: PeopleQuery['status']): SQL | undefined =>
  s === 'deactivated' ? eq(users.active, false)
  : s === 'active' ? and(eq(users.active, true), isNotNull(users.passwordHash))
  : s === 'invited' ? and(eq(users.active, true), isNull(users.passwordHash))
  : undefined;

const likeEscape = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

const personColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  clinicId: users.clinicId,
  clinicCode: clinics.code,
  active: users.active,
  invited: sql<boolean>`${users.passwordHash} is null`,
  createdAt: users.createdAt,
  deactivatedAt: users.deactivatedAt,
};

type Row = { active: boolean; invited: boolean; createdAt: Date; deactivatedAt: Date | null } & Omit<Person, 'status' | 'createdAt' | 'deactivatedAt'>;

function toPerson({ active, invited, ...r }: Row): Person {
  return { ...r, status: !active ? 'deactivated' : invited ? 'invited' : 'active', createdAt: iso(r.createdAt)!, deactivatedAt: iso(r.deactivatedAt) };
}

export async function listPeople(db: Db, scope: Scope, q: PeopleQuery): Promise<{ items: Person[]; total: number }> {
  const text = q.q ? `%${likeEscape(q.q)}%` : undefined;
  const where = and(
    visibleTo(scope),
    q.clinicId !== undefined ? eq(users.clinicId, q.clinicId) : undefined,
    q.role ? eq(users.role, q.role) : undefined,
    statusCondition(q.status),
    text ? or(ilike(users.name, text), ilike(users.email, text)) : undefined,
  );
  const [rows, [total]] = await Promise.all([
    db.select(personColumns).from(users).leftJoin(clinics, eq(clinics.id, users.clinicId)).where(where)
      .orderBy(asc(clinics.code), asc(users.role), asc(users.email)).limit(q.limit).offset(q.offset),
    db.select({ n: count() }).from(users).where(where),
  ]);
  return { items: rows.map(toPerson), total: total?.n ?? 0 };
}

async function personById(db: Db, id: number): Promise<Person> {
  const [row] = await db.select(personColumns).from(users).leftJoin(clinics, eq(clinics.id, users.clinicId)).where(eq(users.id, id));
  if (!row) throw new NotFoundError('No such person');
  return toPerson(row);
}

/**
 * Steward only: a new role and/or clinic. Leads and clinicians need an active clinic; stewards and
 * researchers belong to none. Nobody changes their own role (the registry must keep a steward).
 */
export async function updatePerson(db: Db, scope: Scope, id: number, patch: PersonPatch): Promise<Person> {
  assertSteward(scope);
  if (id === scope.userId) throw new ForbiddenError('You cannot change your own role or clinic; ask another steward');
  await db.transaction(async (tx) => {
    const [before] = await tx.select().from(users).where(eq(users.id, id)).for('update');
    if (!before) throw new NotFoundError('No such person');
    if (!before.active) throw new ConflictError('This account is deactivated');
    const role = patch.role ?? before.role;
    const needsClinic = CLINIC_ROLES.includes(role);
    // Explicit over convenient: leaving a clinic is always said (clinicId: null), never implied by a role.
    const clinicId = patch.clinicId !== undefined ? patch.clinicId : before.clinicId;
    if (needsClinic && clinicId == null) {
      throw new ValidationError('Choose the clinic', [{ path: ['clinicId'], message: 'A clinic lead or clinician needs a clinic' }]);
    }
    if (!needsClinic && clinicId != null) {
      throw new ValidationError('Stewards and researchers belong to no clinic', [{ path: ['clinicId'], message: 'Leave the clinic empty for this role' }]);
    }
    if (clinicId != null && clinicId !== before.clinicId) {
      const [clinic] = await tx.select({ active: clinics.active }).from(clinics).where(eq(clinics.id, clinicId));
      if (!clinic || !clinic.active) throw new ValidationError('No such clinic', [{ path: ['clinicId'], message: 'No active clinic with this id' }]);
    }
    const changes = changesOf(before, { role, clinicId });
    if (Object.keys(changes).length === 0) return;
    await tx.update(users).set({ role, clinicId }).where(eq(users.id, id));
    await audit(tx, {
      actorId: scope.userId,
      clinicId: clinicId ?? before.clinicId,
      action: 'update',
      entity: 'user',
      entityId: id,
      detail: { changes },
    });
  });
  return personById(db, id);
}
