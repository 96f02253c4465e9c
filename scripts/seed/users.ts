/**
 * The demo's four accounts, one per role, all with the demo password (see README). The lead and the
 * clinician work at the first demo clinic. Fictional people; they exist only when the demo is loaded.
 */
import { eq } from 'drizzle-orm';
import type { Db } from '../../server/db/client';
import { clinics, users } from '../../server/db/schema';
import { hashPassword } from '../../server/auth/passwords';
import { audit } from '../../server/services/audit';
import { DEMO_PASSWORD, DEMO_USERS } from '../seed';

const NAMES: Record<(typeof DEMO_USERS)[number]['role'], string> = {
  steward: 'Ilse Marchetti',
  lead: 'Tomasz Achebe',
  clinician: 'Priya Lindqvist',
  researcher: 'Joaquin Oyelaran',
};

/** Creates the demo accounts (skipping any that exist); returns how many it created. */
export async function loadDemoUsers(db: Db): Promise<number> {
  // C01 is the first demo clinic of scripts/seed.ts
  const [clinic] = await db.select({ id: clinics.id }).from(clinics).where(eq(clinics.code, 'C01'));
  if (!clinic) throw new Error('loadDemoUsers: load the demo clinics first');
  let created = 0;
  for (const { role, email } of DEMO_USERS) {
    const clinicId = role === 'lead' || role === 'clinician' ? clinic.id : null;
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    const rows = await db
      .insert(users)
      .values({ email, name: NAMES[role], role, clinicId, passwordHash })
      .onConflictDoNothing({ target: users.email })
      .returning({ id: users.id });
    if (rows[0]) {
      created++;
      await audit(db, {
        actorId: null,
        clinicId,
        action: 'seed',
        entity: 'user',
        entityId: rows[0].id,
        detail: { role },
      });
    }
  }
  return created;
}
