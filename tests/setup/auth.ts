import request from 'supertest';
import type { Express } from 'express';
import { randomBytes } from 'node:crypto';
import type { Db } from '../../server/db/client';
import { clinics, users } from '../../server/db/schema';
import { hashPassword } from '../../server/auth/passwords';
import type { Role } from '../../shared/roles';

export const TEST_PASSWORD = 'correct-horse-battery';
let cachedHash: Promise<string> | undefined;

/** Inserts an active user with the test password straight into the database. */
export async function createUser(db: Db, role: Role, clinicId: number | null = null, email?: string) {
  cachedHash ??= hashPassword(TEST_PASSWORD);
  const address = email ?? `${role}-${randomBytes(4).toString('hex')}@test.loadline.test`;
  const [row] = await db
    .insert(users)
    .values({ email: address, name: `Test ${role}`, role, clinicId, passwordHash: await cachedHash })
    .returning({ id: users.id, email: users.email });
  return { id: row!.id, email: row!.email, role, clinicId };
}

/** Inserts a clinic with a unique code (integration tests share one database per run). */
export async function createClinic(db: Db, displayName = 'Test clinic') {
  const code = `T${randomBytes(3).toString('hex').toUpperCase()}`;
  const [row] = await db.insert(clinics).values({ code, displayName, region: 'Test region' }).returning();
  return { id: row!.id, code, displayName };
}

/** A cookie-keeping client that sends the CSRF header on every state-changing request. */
export type Client = Awaited<ReturnType<typeof anonymousClient>>;

export async function anonymousClient(app: Express) {
  const agent = request.agent(app);
  let csrf = (await agent.get('/api/auth/csrf')).body.token as string;
  return {
    agent,
    get: (url: string) => agent.get(url),
    post: (url: string) => agent.post(url).set('x-csrf-token', csrf),
    put: (url: string) => agent.put(url).set('x-csrf-token', csrf),
    patch: (url: string) => agent.patch(url).set('x-csrf-token', csrf),
    delete: (url: string) => agent.delete(url).set('x-csrf-token', csrf),
    refreshCsrf: async () => {
      csrf = (await agent.get('/api/auth/csrf')).body.token as string;
    },
  };
}

/** Signs in through the real login route and returns a client bound to that session. */
export async function signedInClient(app: Express, email: string, password = TEST_PASSWORD): Promise<Client> {
  const client = await anonymousClient(app);
  const res = await client.post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  await client.refreshCsrf();
  return client;
}
