import { beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { auditEvents, authTokens, users } from '../../server/db/schema';
import { testAppWithMail } from '../setup/mail';
import { anonymousClient, createClinic, createUser, signedInClient } from '../setup/auth';

const ctx = testAppWithMail();
const NEW_PASSWORD = 'a-long-new-password-42';
let clinicA: number;
let clinicB: number;
const unique = () => Math.random().toString(36).slice(2, 8);

beforeAll(async () => {
  clinicA = (await createClinic(ctx.db, 'Invite clinic A')).id;
  clinicB = (await createClinic(ctx.db, 'Invite clinic B')).id;
});

async function steward() {
  const s = await createUser(ctx.db, 'steward');
  return { user: s, client: await signedInClient(ctx.app, s.email) };
}

describe('invitation round-trip through the fake SMTP server', () => {
  it('steward invites a lead; the e-mail link sets name and password, signs in, and the link is then spent', async () => {
    const { client } = await steward();
    const email = `new-lead-${unique()}@test.loadline.test`;
    const res = await client.post('/api/invitations').send({ email, role: 'lead', clinicId: clinicA });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      account: { email, role: 'lead', clinicId: clinicA, state: 'invited' },
      mailSent: true,
    });
    const hours = (Date.parse(res.body.expiresAt) - Date.now()) / 3_600_000;
    expect(hours).toBeGreaterThan(71.9);
    expect(hours).toBeLessThanOrEqual(72);

    const mail = ctx.mail.lastTo(email);
    expect(mail.subject).toMatch(/Loadline/);
    expect(mail.text).toMatch(/Loadline/);
    expect(mail.html).toMatch(/<a href="http/);
    expect(mail.text).toContain('Invite clinic A');
    const token = ctx.mail.tokenFrom(mail, '/accept-invitation');
    // only the hash is stored
    const stored = await ctx.db.select().from(authTokens).where(eq(authTokens.userId, res.body.account.id));
    expect(stored).toHaveLength(1);
    expect(stored[0]!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored[0]!.tokenHash).not.toContain(token);

    // before accepting, the invitee cannot sign in
    const early = await anonymousClient(ctx.app);
    expect((await early.post('/api/auth/login').send({ email, password: NEW_PASSWORD })).status).toBe(401);

    const invitee = await anonymousClient(ctx.app);
    const accepted = await invitee
      .post('/api/invitations/accept')
      .send({ token, name: 'Nia Okafor', password: NEW_PASSWORD });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user).toMatchObject({ email, name: 'Nia Okafor', role: 'lead', clinicId: clinicA });
    expect((await invitee.get('/api/auth/me')).body.user.email).toBe(email);

    const again = await anonymousClient(ctx.app);
    const reused = await again
      .post('/api/invitations/accept')
      .send({ token, name: 'Someone else', password: 'another-password-99' });
    expect(reused.status).toBe(410);
    expect(reused.body.error.message).toMatch(/already been used/);
    const [row] = await ctx.db.select().from(users).where(eq(users.email, email));
    expect(row!.name).toBe('Nia Okafor');

    const later = await signedInClient(ctx.app, email, NEW_PASSWORD);
    expect((await later.get('/api/auth/me')).status).toBe(200);
    const actions = (
      await ctx.db
        .select()
        .from(auditEvents)
        .where(eq(auditEvents.entityId, String(row!.id)))
    ).map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['invite', 'accept-invitation']));
  });

  it('a lead invites a clinician of their own clinic only', async () => {
    const lead = await createUser(ctx.db, 'lead', clinicA);
    const client = await signedInClient(ctx.app, lead.email);
    const email = `new-clin-${unique()}@test.loadline.test`;
    const ok = await client.post('/api/invitations').send({ email, role: 'clinician' });
    expect(ok.status).toBe(201);
    expect(ok.body.account.clinicId).toBe(clinicA);
    const other = await client
      .post('/api/invitations')
      .send({ email: `x-${unique()}@test.loadline.test`, role: 'clinician', clinicId: clinicB });
    expect(other.status).toBe(403);
    const asLead = await client
      .post('/api/invitations')
      .send({ email: `y-${unique()}@test.loadline.test`, role: 'lead' });
    expect(asLead.status).toBe(403);
  });

  it('refuses what a role may not invite, bad input and duplicates, and changes nothing', async () => {
    const { client } = await steward();
    const clin = await createUser(ctx.db, 'clinician', clinicA);
    const c = await signedInClient(ctx.app, clin.email);
    const before = (await ctx.db.select({ id: users.id }).from(users)).length;
    expect((await c.post('/api/invitations').send({ email: `z-${unique()}@t.test`, role: 'clinician' })).status).toBe(
      403,
    );
    expect(
      (
        await client
          .post('/api/invitations')
          .send({ email: `z-${unique()}@t.test`, role: 'clinician', clinicId: clinicA })
      ).status,
    ).toBe(403);
    expect((await client.post('/api/invitations').send({ email: `z-${unique()}@t.test`, role: 'lead' })).status).toBe(
      422,
    );
    expect(
      (
        await client
          .post('/api/invitations')
          .send({ email: `z-${unique()}@t.test`, role: 'researcher', clinicId: clinicA })
      ).status,
    ).toBe(422);
    expect((await client.post('/api/invitations').send({ email: 'not-an-email', role: 'steward' })).status).toBe(422);
    expect(
      (await client.post('/api/invitations').send({ email: `z-${unique()}@t.test`, role: 'lead', clinicId: 999999 }))
        .status,
    ).toBe(422);
    expect((await client.post('/api/invitations').send({ email: clin.email, role: 'steward' })).status).toBe(409);
    expect((await ctx.db.select({ id: users.id }).from(users)).length).toBe(before);
  });

  it('resending makes a new link and the old one stops working; tampered and expired links are refused', async () => {
    const { client } = await steward();
    const email = `resend-${unique()}@test.loadline.test`;
    const { body } = await client.post('/api/invitations').send({ email, role: 'researcher' });
    const first = ctx.mail.tokenFrom(ctx.mail.lastTo(email), '/accept-invitation');
    const resent = await client.post(`/api/invitations/${body.account.id}/resend`);
    expect(resent.status).toBe(200);
    const second = ctx.mail.tokenFrom(ctx.mail.lastTo(email), '/accept-invitation');
    expect(second).not.toBe(first);

    const anon = await anonymousClient(ctx.app);
    const old = await anon.post('/api/invitations/accept').send({ token: first, name: 'R', password: NEW_PASSWORD });
    expect(old.status).toBe(410);
    const tampered = second.slice(0, -2) + (second.endsWith('AA') ? 'BB' : 'AA');
    const bad = await anon.post('/api/invitations/accept').send({ token: tampered, name: 'R', password: NEW_PASSWORD });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/not valid/);
    await ctx.db
      .update(authTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(and(eq(authTokens.userId, body.account.id), eq(authTokens.purpose, 'invite')));
    const expired = await anon
      .post('/api/invitations/accept')
      .send({ token: second, name: 'R', password: NEW_PASSWORD });
    expect(expired.status).toBe(410);
    expect(expired.body.error.message).toMatch(/expired/);
    const [row] = await ctx.db.select().from(users).where(eq(users.email, email));
    expect(row!.passwordHash).toBeNull();
    expect(row!.name).toBe('');
    // a short password is a 422 and spends nothing
    const third = await client.post(`/api/invitations/${body.account.id}/resend`);
    expect(third.status).toBe(200);
    const t3 = ctx.mail.tokenFrom(ctx.mail.lastTo(email), '/accept-invitation');
    expect((await anon.post('/api/invitations/accept').send({ token: t3, name: 'R', password: 'short' })).status).toBe(
      422,
    );
    expect(
      (await anon.post('/api/invitations/accept').send({ token: t3, name: 'Rafa', password: NEW_PASSWORD })).status,
    ).toBe(200);
    expect((await client.post(`/api/invitations/${body.account.id}/resend`)).status).toBe(409);
  });

  it('a lead cannot resend or deactivate for another clinic (404) and a deactivated user is refused on the next request', async () => {
    const leadA = await createUser(ctx.db, 'lead', clinicA);
    const clinB = await createUser(ctx.db, 'clinician', clinicB);
    const clinA = await createUser(ctx.db, 'clinician', clinicA);
    const lead = await signedInClient(ctx.app, leadA.email);
    expect((await lead.post(`/api/users/${clinB.id}/deactivate`)).status).toBe(404);
    expect((await lead.post(`/api/invitations/${clinB.id}/resend`)).status).toBe(404);
    const otherLead = await createUser(ctx.db, 'lead', clinicA);
    expect((await lead.post(`/api/users/${otherLead.id}/deactivate`)).status).toBe(403);

    const victim = await signedInClient(ctx.app, clinA.email);
    expect((await victim.get('/api/auth/me')).status).toBe(200);
    const res = await lead.post(`/api/users/${clinA.id}/deactivate`);
    expect(res.status).toBe(200);
    expect(res.body.account.state).toBe('deactivated');
    expect((await victim.get('/api/auth/me')).status).toBe(401);
    const retry = await anonymousClient(ctx.app);
    expect(
      (await retry.post('/api/auth/login').send({ email: clinA.email, password: 'correct-horse-battery' })).status,
    ).toBe(401);
    const list = await lead.get('/api/users');
    expect(list.status).toBe(200);
    expect(list.body.accounts.every((a: { clinicId: number }) => a.clinicId === clinicA)).toBe(true);
    expect(list.body.accounts.find((a: { id: number }) => a.id === clinA.id).state).toBe('deactivated');
  });
});
