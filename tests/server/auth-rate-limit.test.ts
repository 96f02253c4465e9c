import { beforeAll, describe, expect, it } from 'vitest';
import { testApp } from '../setup/test-app';
import { anonymousClient, createClinic, createUser, TEST_PASSWORD } from '../setup/auth';
import { afterAll } from 'vitest';

const ctx = testApp();
afterAll(() => ctx.close());
let clinicId: number;
beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'Rate clinic')).id;
});

// The app trusts the loopback proxy, so X-Forwarded-For stands in for different client addresses.
const from = (ip: string) => ({ 'x-forwarded-for': ip });

describe('rate limits on sign-in and reset', () => {
  it('per account: the 11th attempt within the window is a 429 even with the right password, from any address', async () => {
    const u = await createUser(ctx.db, 'clinician', clinicId);
    const c = await anonymousClient(ctx.app);
    for (let i = 0; i < 10; i++) {
      const r = await c
        .post('/api/auth/login')
        .set(from(`10.0.1.${i + 1}`))
        .send({ email: u.email, password: `wrong-${i}` });
      expect(r.status).toBe(401);
    }
    const blocked = await c
      .post('/api/auth/login')
      .set(from('10.0.1.99'))
      .send({ email: u.email, password: TEST_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/Too many attempts.*15 minutes/);
    // another account from a fresh address is not affected
    const other = await createUser(ctx.db, 'clinician', clinicId);
    const ok = await c
      .post('/api/auth/login')
      .set(from('10.0.1.100'))
      .send({ email: other.email, password: TEST_PASSWORD });
    expect(ok.status).toBe(200);
  });

  it('per address: ten failures for different accounts block the address, not other addresses', async () => {
    const c = await anonymousClient(ctx.app);
    for (let i = 0; i < 10; i++) {
      const r = await c
        .post('/api/auth/login')
        .set(from('10.0.2.1'))
        .send({ email: `guess-${i}@test.loadline.test`, password: 'nope' });
      expect(r.status).toBe(401);
    }
    const u = await createUser(ctx.db, 'lead', clinicId);
    expect(
      (await c.post('/api/auth/login').set(from('10.0.2.1')).send({ email: u.email, password: TEST_PASSWORD })).status,
    ).toBe(429);
    expect(
      (await c.post('/api/auth/login').set(from('10.0.2.2')).send({ email: u.email, password: TEST_PASSWORD })).status,
    ).toBe(200);
  });

  it('successful sign-ins do not use up the allowance', async () => {
    const u = await createUser(ctx.db, 'clinician', clinicId);
    const c = await anonymousClient(ctx.app);
    for (let i = 0; i < 12; i++) {
      await c.refreshCsrf();
      const r = await c.post('/api/auth/login').set(from('10.0.3.1')).send({ email: u.email, password: TEST_PASSWORD });
      expect(r.status).toBe(200);
    }
  });

  it('forgot-password is limited per account and per address; reset per address', async () => {
    const c = await anonymousClient(ctx.app);
    for (let i = 0; i < 10; i++) {
      expect(
        (
          await c
            .post('/api/auth/forgot')
            .set(from(`10.0.4.${i + 1}`))
            .send({ email: 'target@test.loadline.test' })
        ).status,
      ).toBe(202);
    }
    expect(
      (await c.post('/api/auth/forgot').set(from('10.0.4.50')).send({ email: 'target@test.loadline.test' })).status,
    ).toBe(429);
    for (let i = 0; i < 10; i++) {
      expect(
        (
          await c
            .post('/api/auth/forgot')
            .set(from('10.0.5.1'))
            .send({ email: `a${i}@test.loadline.test` })
        ).status,
      ).toBe(202);
    }
    expect(
      (await c.post('/api/auth/forgot').set(from('10.0.5.1')).send({ email: 'fresh@test.loadline.test' })).status,
    ).toBe(429);
    const token = 'A'.repeat(43);
    for (let i = 0; i < 10; i++) {
      expect(
        (await c.post('/api/auth/reset').set(from('10.0.6.1')).send({ token, password: 'long-enough-password' }))
          .status,
      ).toBe(400);
    }
    expect(
      (await c.post('/api/auth/reset').set(from('10.0.6.1')).send({ token, password: 'long-enough-password' })).status,
    ).toBe(429);
  });

  it('limits belong to one app instance: a new app starts with a clean slate', async () => {
    const { createApp } = await import('../../server/app');
    const u = await createUser(ctx.db, 'clinician', clinicId);
    const first = await anonymousClient(ctx.app);
    for (let i = 0; i < 11; i++)
      await first.post('/api/auth/login').set(from('10.0.7.1')).send({ email: u.email, password: 'bad' });
    expect(
      (await first.post('/api/auth/login').set(from('10.0.7.1')).send({ email: u.email, password: TEST_PASSWORD }))
        .status,
    ).toBe(429);
    const second = await anonymousClient(createApp({ db: ctx.db, pool: ctx.pool, log: () => undefined }));
    expect(
      (await second.post('/api/auth/login').set(from('10.0.7.1')).send({ email: u.email, password: TEST_PASSWORD }))
        .status,
    ).toBe(200);
  });
});
