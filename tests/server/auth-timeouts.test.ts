import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { testApp } from '../setup/test-app';
import { anonymousClient, createClinic, createUser, TEST_PASSWORD } from '../setup/auth';

// Time is moved by editing the stored session exactly as the passing of time would leave it
// (its expiry, its sign-in instant), so nothing here sleeps.
const ctx = testApp();
afterAll(() => ctx.close());
let clinicId: number;
beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'Timeout clinic')).id;
});

async function signIn() {
  const u = await createUser(ctx.db, 'clinician', clinicId);
  const c = await anonymousClient(ctx.app);
  const res = await c.post('/api/auth/login').send({ email: u.email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  const cookie = (res.headers['set-cookie'] as unknown as string[]).find((x) => x.startsWith('loadline.sid='))!;
  const sid = decodeURIComponent(cookie.split(';')[0]!.split('=')[1]!).replace(/^s:/, '').split('.')[0]!;
  return { c, sid, cookie };
}

const row = async (sid: string) =>
  (
    await ctx.db.execute<{ minutesLeft: number; sess: { signedInAt: number } }>(
      sql`select extract(epoch from (expire::timestamptz - now())) / 60 as "minutesLeft", sess from "session" where sid = ${sid}`,
    )
  ).rows[0];

describe('session time-outs', () => {
  it('idle: the cookie and the stored session last 30 minutes, each request rolls them, and past that it is a 401', async () => {
    const { c, sid, cookie } = await signIn();
    const cookieMinutes = (Date.parse(/Expires=([^;]+)/.exec(cookie)![1]!) - Date.now()) / 60_000;
    expect(cookieMinutes).toBeGreaterThan(29);
    expect(cookieMinutes).toBeLessThanOrEqual(30.1);
    const ahead = Number((await row(sid))!.minutesLeft);
    expect(ahead).toBeGreaterThan(29.5);
    expect(ahead).toBeLessThanOrEqual(30.1);

    // 20 idle minutes pass, then one request rolls the expiry forward again
    await ctx.db.execute(sql`update "session" set expire = now() + interval '10 minutes' where sid = ${sid}`);
    expect((await c.get('/api/auth/me')).status).toBe(200);
    expect(Number((await row(sid))!.minutesLeft)).toBeGreaterThan(29.5);

    // 31 idle minutes pass
    await ctx.db.execute(sql`update "session" set expire = now() - interval '1 minute' where sid = ${sid}`);
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });

  it('absolute: a session signed in more than 12 hours ago ends whatever its activity', async () => {
    const { c, sid } = await signIn();
    const at = (h: number) => Date.now() - h * 3_600_000;
    await ctx.db.execute(
      sql`update "session" set sess = jsonb_set(sess::jsonb, '{signedInAt}', to_jsonb(${at(11.9)}::bigint))::json where sid = ${sid}`,
    );
    expect((await c.get('/api/auth/me')).status).toBe(200);
    expect((await row(sid))!.sess.signedInAt).toBeLessThan(at(11.8)); // activity does not renew the sign-in instant
    await ctx.db.execute(
      sql`update "session" set sess = jsonb_set(sess::jsonb, '{signedInAt}', to_jsonb(${at(12.1)}::bigint))::json where sid = ${sid}`,
    );
    const res = await c.get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(await row(sid)).toBeUndefined(); // the stored session is gone, not just ignored
    // and signing in again works normally
    await c.refreshCsrf();
    const me = await createUser(ctx.db, 'clinician', clinicId);
    expect((await c.post('/api/auth/login').send({ email: me.email, password: TEST_PASSWORD })).status).toBe(200);
  });
});
