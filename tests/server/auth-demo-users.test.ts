import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { createApp } from '../../server/app';
import { openDatabase, type Database } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { clinics, users } from '../../server/db/schema';
import { createDatabase, dropDatabase, ensurePostgres } from '../../scripts/db';
import { DEMO_PASSWORD, DEMO_USERS } from '../../scripts/seed';
import { loadDemoUsers } from '../../scripts/seed/users';
import { signedInClient } from '../setup/auth';

// A database of its own: the demo's clinic codes and e-mails are fixed.
const name = `loadline_demo_users_${randomBytes(3).toString('hex')}`;
let cluster: Awaited<ReturnType<typeof ensurePostgres>>;
let database: Database;
beforeAll(async () => {
  cluster = await ensurePostgres();
  database = openDatabase(await createDatabase(cluster, name, false), 3);
  await migrateDatabase(database.db);
});
afterAll(async () => {
  await database.pool.end();
  await dropDatabase(cluster, name);
});

describe('demo accounts', () => {
  it('one per role with the demo password; lead and clinician at the first demo clinic; idempotent', async () => {
    const [c01] = await database.db
      .insert(clinics)
      .values({ code: 'C01', displayName: 'Demo one', region: 'R' })
      .returning();
    await database.db.insert(clinics).values({ code: 'C02', displayName: 'Demo two', region: 'R' });
    expect(await loadDemoUsers(database.db)).toBe(4);
    expect(await loadDemoUsers(database.db)).toBe(0);
    const app = createApp({ ...database, log: () => undefined });
    for (const { role, email } of DEMO_USERS) {
      const client = await signedInClient(app, email, DEMO_PASSWORD);
      const me = (await client.get('/api/auth/me')).body.user;
      expect(me.role).toBe(role);
      expect(me.name.length).toBeGreaterThan(0);
      expect(me.clinicId).toBe(role === 'lead' || role === 'clinician' ? c01!.id : null);
    }
    const [row] = await database.db.select().from(users).where(eq(users.email, 'steward@demo.loadline.test'));
    expect(row!.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,p=1,t=2\$/);
  });
});
