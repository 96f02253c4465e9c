import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { clinics, users } from '../../server/db/schema';
import { testApp } from '../setup/test-app';
import { anonymousClient, createUser, signedInClient, TEST_PASSWORD } from '../setup/auth';

const ctx = testApp();
let clinicId: number;
afterAll(() => ctx.close());
beforeAll(async () => {
  const [c] = await ctx.db
    .insert(clinics)
    .values({ code: `T${Date.now() % 100000}`, displayName: 'Test clinic', region: 'Test region' })
    .returning();
  clinicId = c!.id;
});

describe('sign-in and sessions', () => {
  it('signs in, answers /me, signs out', async () => {
    const u = await createUser(ctx.db, 'clinician', clinicId);
    const client = await signedInClient(ctx.app, u.email);
    const me = await client.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toEqual({ id: u.id, email: u.email, name: 'Test clinician', role: 'clinician', clinicId });
    expect((await client.post('/api/auth/logout')).status).toBe(204);
    expect((await client.get('/api/auth/me')).status).toBe(401);
  });

  it('regenerates the session id on sign-in and sets HttpOnly, SameSite=Lax', async () => {
    const u = await createUser(ctx.db, 'lead', clinicId);
    const client = await anonymousClient(ctx.app);
    const res = await client.post('/api/auth/login').send({ email: u.email, password: TEST_PASSWORD });
    const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('loadline.sid='))!;
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    // signing in again from the same browser issues a new session id (no fixation)
    await client.refreshCsrf();
    const again = await client.post('/api/auth/login').send({ email: u.email, password: TEST_PASSWORD });
    const cookie2 = (again.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('loadline.sid='))!;
    expect(again.status).toBe(200);
    expect(cookie2.split(';')[0]).not.toBe(cookie.split(';')[0]);
  });

  it('answers the same for an unknown e-mail and a wrong password, and never echoes the password', async () => {
    const u = await createUser(ctx.db, 'clinician', clinicId);
    const client = await anonymousClient(ctx.app);
    const wrong = await client.post('/api/auth/login').send({ email: u.email, password: 'not-the-password' });
    const unknown = await client.post('/api/auth/login').send({ email: 'nobody@test.loadline.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(JSON.stringify(wrong.body)).not.toContain('not-the-password');
  });

  it('refuses a state-changing request without the CSRF token (403)', async () => {
    const u = await createUser(ctx.db, 'clinician', clinicId);
    const client = await signedInClient(ctx.app, u.email);
    const res = await client.agent.post('/api/auth/logout');
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/CSRF/);
    expect((await client.get('/api/auth/me')).status).toBe(200);
  });

  it('a deactivated user is refused on the next request', async () => {
    const u = await createUser(ctx.db, 'clinician', clinicId);
    const client = await signedInClient(ctx.app, u.email);
    expect((await client.get('/api/auth/me')).status).toBe(200);
    await ctx.db.update(users).set({ active: false }).where(eq(users.id, u.id));
    expect((await client.get('/api/auth/me')).status).toBe(401);
    const again = await anonymousClient(ctx.app);
    expect((await again.post('/api/auth/login').send({ email: u.email, password: TEST_PASSWORD })).status).toBe(401);
  });
});
