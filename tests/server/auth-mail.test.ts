import { afterAll, describe, expect, it } from 'vitest';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { devOutbox } from '../../server/mail/outbox';
import { invitationMail, resetMail } from '../../server/mail/templates';
import { testAppWithMail } from '../setup/mail';
import { anonymousClient, createClinic, createUser, signedInClient } from '../setup/auth';

const ctx = testAppWithMail();

describe('fake SMTP server and mailer', () => {
  const servers: Array<{ stop(): Promise<void> }> = [];
  afterAll(() => Promise.all(servers.map((s) => s.stop())));

  it('receives a message with both parts over real SMTP and finds its links', async () => {
    const smtp = await startFakeSmtp({ port: 0, shareWithOutbox: false });
    servers.push(smtp);
    expect(smtp.port).toBeGreaterThan(0);
    await smtp.mailer.send({
      to: 'Someone@Test.Loadline.Test',
      subject: 'Hello from a test',
      text: 'Plain part: http://127.0.0.1:9/accept-invitation?token=abc',
      html: '<p>HTML part <a href="http://127.0.0.1:9/reset-password?token=def&amp;x=1">go</a></p>',
    });
    const [m] = smtp.messages();
    expect(m).toMatchObject({ to: ['someone@test.loadline.test'], subject: 'Hello from a test' });
    expect(m!.text).toContain('Plain part');
    expect(m!.html).toContain('HTML part');
    expect(m!.links).toEqual([
      'http://127.0.0.1:9/accept-invitation?token=abc',
      'http://127.0.0.1:9/reset-password?token=def&x=1',
    ]);
    expect(devOutbox.list().some((x) => x.subject === 'Hello from a test')).toBe(false);
    smtp.clear();
    expect(smtp.messages()).toEqual([]);
  });

  it('the e-mails name the product, have both parts, carry the link and escape names in HTML', () => {
    const link = 'http://127.0.0.1:3000/accept-invitation?token=T';
    const inv = invitationMail('a@b.test', 'lead', 'Fox & <Hound> Clinic', link);
    const reset = resetMail('a@b.test', 'http://127.0.0.1:3000/reset-password?token=R');
    for (const m of [inv, reset]) {
      expect(m.subject).toMatch(/Loadline/);
      expect(m.text).toMatch(/Loadline/);
      expect(m.html).toMatch(/Loadline/);
    }
    expect(inv.text).toContain(link);
    expect(inv.html).toContain(`href="${link}"`);
    expect(inv.html).toContain('Fox &amp; &lt;Hound&gt; Clinic');
    expect(inv.text).toMatch(/72 hours/);
    expect(reset.text).toMatch(/one hour/);
  });
});

describe('GET /api/dev/outbox (development only, stewards only)', () => {
  it('lists received messages with their links to a steward; others are refused', async () => {
    const clinic = await createClinic(ctx.db, 'Outbox clinic');
    const steward = await createUser(ctx.db, 'steward');
    const lead = await createUser(ctx.db, 'lead', clinic.id);
    const s = await signedInClient(ctx.app, steward.email);
    const email = `outbox-${Date.now()}@test.loadline.test`;
    expect((await s.post('/api/invitations').send({ email, role: 'researcher' })).status).toBe(201);
    const res = await s.get('/api/dev/outbox');
    expect(res.status).toBe(200);
    const m = res.body.messages.find((x: { to: string[] }) => x.to.includes(email));
    expect(m.subject).toMatch(/invitation/i);
    expect(m.links[0]).toMatch(/\/accept-invitation\?token=/);
    expect((await (await signedInClient(ctx.app, lead.email)).get('/api/dev/outbox')).status).toBe(403);
    expect((await (await anonymousClient(ctx.app)).get('/api/dev/outbox')).status).toBe(401);
  });
});
