import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { users } from '../../../server/db/schema';
import { newPage, signIn, startE2eApp, type E2eApp, type E2ePage } from '../harness';

// Journey 1: the demo lead invites a clinician from the Team screen; the clinician opens the e-mailed link in a
// browser of their own, sets a name and password, is signed in, signs out and signs in again with that password.
let app: E2eApp;
let lead: E2ePage;
let invitee: E2ePage;

beforeAll(async () => {
  app = await startE2eApp();
  lead = await newPage(app);
  invitee = await newPage(app);
});

afterAll(async () => {
  await lead?.close();
  await invitee?.close();
  await app?.close();
});

describe('journey: a lead invites a clinician', () => {
  it('invitation e-mail → link → password → signed in, and signs in again with the new password', async () => {
    onTestFailed(async () => {
      await lead.saveArtifacts('journey-invite-lead');
      await invitee.saveArtifacts('journey-invite-clinician');
    });
    const email = `j1-${randomBytes(4).toString('hex')}@clinic.loadline.test`;
    const password = `heel-${randomBytes(6).toString('hex')}`;

    // The lead: signed out, /api/auth/me answers 401 by design until the sign-in.
    lead.allow(401, '/api/auth/me');
    await signIn(lead.page, 'lead@demo.loadline.test');
    const { page } = lead;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }).click();
    const form = page.getByRole('form', { name: 'Invite a person' });
    await form.getByLabel('E-mail address').fill(email);
    expect(await form.getByLabel('Role').inputValue()).toBe('clinician');
    const sent = page.waitForResponse((r) => new URL(r.url()).pathname === '/api/invitations' && r.request().method() === 'POST');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    expect((await sent).status()).toBe(201);
    await expect.poll(() => page.getByText(`Invitation sent to ${email}`).count()).toBe(1);
    expect(lead.problems()).toEqual([]);

    // The account exists without a password, in the lead's clinic, until the link is used.
    const [leadRow] = await app.db.select().from(users).where(eq(users.email, 'lead@demo.loadline.test'));
    const [pending] = await app.db.select().from(users).where(eq(users.email, email));
    expect(pending).toMatchObject({ role: 'clinician', clinicId: leadRow!.clinicId, passwordHash: null });

    // The e-mail, as the fake SMTP server received it.
    await expect.poll(() => app.mail.messages().filter((m) => m.to.includes(email)).length).toBe(1);
    const mail = app.mail.messages().find((m) => m.to.includes(email))!;
    const link = mail.links.map((l) => new URL(l)).find((u) => u.pathname === '/accept-invitation');
    expect(link?.searchParams.get('token')).toMatch(/^[A-Za-z0-9_-]{43}$/);

    // The clinician follows it (its host is the configured APP_URL; the path and token are what matter here).
    invitee.allow(401, '/api/auth/me');
    const p = invitee.page;
    await p.goto(`${link!.pathname}${link!.search}`);
    await expect.poll(() => p.getByRole('heading', { name: 'Set up your account' }).count()).toBe(1);
    await p.getByLabel('Your name').fill('Noor Invited');
    await p.getByLabel('Password', { exact: true }).fill(password);
    await p.getByLabel('Password again').fill(password);
    await p.getByRole('button', { name: 'Open my account' }).click();
    await p.waitForURL((u) => u.pathname === '/');
    await expect.poll(() => p.getByText('Noor Invited').count()).toBe(1);
    const nav = p.getByRole('navigation', { name: 'Main' });
    expect(await nav.getByRole('link', { name: 'Caseload' }).count()).toBe(1);
    expect(await nav.getByRole('link', { name: 'Team' }).count()).toBe(0); // a clinician invites nobody

    const [active] = await app.db.select().from(users).where(eq(users.email, email));
    expect(active!.name).toBe('Noor Invited');
    expect(active!.passwordHash).toMatch(/^\$argon2id\$/);

    // Signs out, then in again with the password just chosen.
    await p.getByRole('button', { name: 'Sign out' }).click();
    await p.waitForURL((u) => u.pathname === '/sign-in');
    await signIn(p, email, password);
    await expect.poll(() => p.getByText('Noor Invited').count()).toBe(1);
    await p.goto('/episodes');
    await expect.poll(() => p.getByRole('heading', { level: 1 }).first().textContent()).toBeTruthy();
    expect(invitee.problems()).toEqual([]);
  });
});
