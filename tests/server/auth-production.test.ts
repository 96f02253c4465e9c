import { afterAll, beforeAll, describe, expect, it, inject, vi } from 'vitest';
import type { Express } from 'express';
import { openDatabase, type Database } from '../../server/db/client';
import request from 'supertest';
import { createUser, TEST_PASSWORD } from '../setup/auth';

// This file's modules see NODE_ENV=production (env() is read once per test file's module graph).
let database: Database;
let app: Express;
beforeAll(async () => {
  vi.stubEnv('NODE_ENV', 'production');
  vi.stubEnv('SESSION_SECRET', 'production-like-secret-for-this-test-only-0123456789');
  const { createApp } = await import('../../server/app');
  database = openDatabase(inject('databaseUrl'), 3);
  app = createApp({ ...database, log: () => undefined });
});
afterAll(async () => {
  await database.pool.end();
  vi.unstubAllEnvs();
});

describe('in production', () => {
  it('the session cookie is Secure, and the outbox does not exist', async () => {
    const steward = await createUser(database.db, 'steward');
    // Secure cookies are not replayed by a cookie jar over plain http, so cookies are passed by hand.
    const https = { 'x-forwarded-proto': 'https' };
    const csrf = await request(app).get('/api/auth/csrf').set(https);
    const csrfCookie = (csrf.headers['set-cookie'] as unknown as string[])[0]!.split(';')[0]!;
    expect(csrf.headers['set-cookie']![0]).toMatch(/; Secure/);
    const res = await request(app)
      .post('/api/auth/login')
      .set(https)
      .set('cookie', csrfCookie)
      .set('x-csrf-token', csrf.body.token)
      .send({ email: steward.email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    const cookie = (res.headers['set-cookie'] as unknown as string[]).find((x) => x.startsWith('loadline.sid='))!;
    expect(cookie).toMatch(/; Secure/);
    expect(cookie).toMatch(/HttpOnly/);
    expect((await request(app).get('/api/auth/me').set(https).set('cookie', cookie.split(';')[0]!)).status).toBe(200);
    const outbox = await request(app).get('/api/dev/outbox').set(https).set('cookie', cookie.split(';')[0]!);
    expect(outbox.status).toBe(404);
  });
});
