import { beforeAll, describe, expect, it } from 'vitest';
import { and, eq, sql } from 'drizzle-orm';
import { auditEvents, authTokens, users } from '../../server/db/schema';
import { testAppWithMail } from '../setup/mail';
import { anonymousClient, createClinic, createUser, signedInClient, TEST_PASSWORD } from '../setup/auth';

const ctx = testAppWithMail();
const NEW_PASSWORD = 'freshly-chosen-passphrase';
let clinicId: number;
beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'Reset clinic')).id;
});

const sessionsOf = async (id: number) =>
  (
    await ctx.db.execute<{ n: number }>(
      sql`select count(*)::int as n from "session" where sess->'passport'->>'user' = ${String(id)}`,
    )
  ).rows[0]!.n;

describe('password reset by e-mail', () => {
  it('round-trip: 202, e-mail link, new password works, old password and ALL old sessions end', async () => {
    const u = await createUser(ctx.db, 'clinician', clinicId);
    const laptop = await signedInClient(ctx.app, u.email);
    const phone = await signedInClient(ctx.app, u.email);
    expect(await sessionsOf(u.id)).toBe(2);

    const anon = await anonymousClient(ctx.app);
    const asked = await anon.post('/api/auth/forgot').send({ email: u.email.toUpperCase() });
    expect(asked.status).toBe(202);
    const mail = await ctx.mail.waitFor(u.email);
    expect(mail.subject).toMatch(/Loadline/);
    expect(mail.html).toMatch(/reset-password\?token=/);
    const token = ctx.mail.tokenFrom(mail, '/reset-password');
    const [stored] = await ctx.db
      .select()
      .from(authTokens)
      .where(and(eq(authTokens.userId, u.id), eq(authTokens.purpose, 'reset')));
    const minutes = (stored!.expiresAt.getTime() - Date.now()) / 60_000;
    expect(minutes).toBeGreaterThan(59);
    expect(minutes).toBeLessThanOrEqual(60);

    const done = await anon.post('/api/auth/reset').send({ token, password: NEW_PASSWORD });
    expect(done.status).toBe(204);
    expect(await sessionsOf(u.id)).toBe(0);
    expect((await laptop.get('/api/auth/me')).status).toBe(401);
    expect((await phone.get('/api/auth/me')).status).toBe(401);

    const oldPw = await anonymousClient(ctx.app);
    expect((await oldPw.post('/api/auth/login').send({ email: u.email, password: TEST_PASSWORD })).status).toBe(401);
    const fresh = await signedInClient(ctx.app, u.email, NEW_PASSWORD);
    expect((await fresh.get('/api/auth/me')).status).toBe(200);

    const reused = await anon.post('/api/auth/reset').send({ token, password: 'yet-another-passphrase' });
    expect(reused.status).toBe(410);
    await signedInClient(ctx.app, u.email, NEW_PASSWORD);
    const actions = (
      await ctx.db
        .select()
        .from(auditEvents)
        .where(eq(auditEvents.entityId, String(u.id)))
    ).map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['request-reset', 'reset-password']));
  });

  it('answers 202 the same for an unknown, a deactivated and an invited account, and sends nothing', async () => {
    const gone = await createUser(ctx.db, 'clinician', clinicId);
    await ctx.db.update(users).set({ active: false }).where(eq(users.id, gone.id));
    const [invited] = await ctx.db
      .insert(users)
      .values({ email: `pending-${Date.now()}@test.loadline.test`, role: 'researcher' })
      .returning();
    const known = await createUser(ctx.db, 'lead', clinicId);
    const anon = await anonymousClient(ctx.app);
    const answers = [];
    for (const email of ['nobody-here@test.loadline.test', gone.email, invited!.email, known.email]) {
      const r = await anon.post('/api/auth/forgot').send({ email });
      answers.push({ status: r.status, body: r.body });
    }
    expect(new Set(answers.map((a) => JSON.stringify(a))).size).toBe(1);
    expect(answers[0]!.status).toBe(202);
    await ctx.mail.waitFor(known.email);
    const to = ctx.mail.messages().flatMap((m) => m.to);
    expect(to).not.toContain(gone.email);
    expect(to).not.toContain(invited!.email);
    expect(to).not.toContain('nobody-here@test.loadline.test');
  });

  it('an expired or tampered reset link is refused and changes nothing', async () => {
    const u = await createUser(ctx.db, 'clinician', clinicId);
    const anon = await anonymousClient(ctx.app);
    await anon.post('/api/auth/forgot').send({ email: u.email });
    const token = ctx.mail.tokenFrom(await ctx.mail.waitFor(u.email), '/reset-password');
    const [before] = await ctx.db.select().from(users).where(eq(users.id, u.id));

    const tampered = (token[0] === 'A' ? 'B' : 'A') + token.slice(1);
    const bad = await anon.post('/api/auth/reset').send({ token: tampered, password: NEW_PASSWORD });
    expect(bad.status).toBe(400);
    expect((await anon.post('/api/auth/reset').send({ token: 'short', password: NEW_PASSWORD })).status).toBe(422);

    await ctx.db
      .update(authTokens)
      .set({ expiresAt: new Date(Date.now() - 1) })
      .where(eq(authTokens.userId, u.id));
    const expired = await anon.post('/api/auth/reset').send({ token, password: NEW_PASSWORD });
    expect(expired.status).toBe(410);
    expect(expired.body.error.message).toMatch(/expired/);
    const [after] = await ctx.db.select().from(users).where(eq(users.id, u.id));
    expect(after!.passwordHash).toBe(before!.passwordHash);
    await signedInClient(ctx.app, u.email);
  });
});
