import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import express from 'express';
import { inject } from 'vitest';
import { sql } from 'drizzle-orm';
import { createApp } from '../../server/app';
import { openDatabase } from '../../server/db/client';
import type { Mailer, MailMessage } from '../../server/mail/transport';
import { withFakeMail } from '../setup/mail';
import { anonymousClient, createClinic, createUser, signedInClient } from '../setup/auth';

// Every byte the app writes (bodies and headers other than the session cookie itself), every line
// it logs and everything printed to the console during the round-trips is kept and searched.
const mail = withFakeMail();
const database = openDatabase(inject('databaseUrl'), 5);
const logs: string[] = [];
const responses: string[] = [];
let failNext = false;
const sentWhileFailing: MailMessage[] = [];
const mailer: Mailer = {
  send: async (m) => {
    if (!failNext) return mail.mailer.send(m);
    sentWhileFailing.push(m);
    throw new Error('relay refused the message');
  },
};
const inner = createApp({ ...database, log: (m) => logs.push(m), mailer });
const app = express();
app.use((_req, res, next) => {
  const chunks: Buffer[] = [];
  const write = res.write.bind(res) as (...a: unknown[]) => boolean;
  const end = res.end.bind(res) as (...a: unknown[]) => unknown;
  res.write = ((chunk: unknown, ...rest: unknown[]) => {
    if (chunk) chunks.push(Buffer.from(chunk as string));
    return write(chunk, ...rest);
  }) as typeof res.write;
  res.end = ((chunk: unknown, ...rest: unknown[]) => {
    if (chunk && typeof chunk !== 'function') chunks.push(Buffer.from(chunk as string));
    const headers = Object.entries(res.getHeaders()).filter(([k]) => k !== 'set-cookie');
    responses.push(JSON.stringify(headers) + Buffer.concat(chunks).toString('utf8'));
    return end(chunk, ...rest);
  }) as typeof res.end;
  next();
});
app.use(inner);

const printed: string[] = [];
beforeEach(() => {
  for (const k of ['log', 'error', 'warn', 'info'] as const) {
    vi.spyOn(console, k).mockImplementation((...a: unknown[]) => void printed.push(a.map(String).join(' ')));
  }
});
afterEach(() => vi.restoreAllMocks());
afterAll(() => database.pool.end());

let clinicId: number;
beforeAll(async () => {
  clinicId = (await createClinic(database.db, 'Secrets clinic')).id;
});

const sidOf = (res: { headers: Record<string, unknown> }) => {
  const c = (res.headers['set-cookie'] as string[] | undefined)?.find((x) => x.startsWith('loadline.sid='));
  return c ? decodeURIComponent(c.split(';')[0]!.split('=')[1]!).replace(/^s:/, '').split('.')[0]! : null;
};

describe('no password, token or session id leaves the app in a log line or a response', () => {
  it('through invitation, sign-in, reset, a failed e-mail and errors', async () => {
    const secrets: string[] = [];
    const password = 'Invitee-Passphrase-7781';
    const lead = await createUser(database.db, 'lead', clinicId);
    const leadClient = await signedInClient(app, lead.email);

    const email = `secret-${Date.now()}@test.loadline.test`;
    expect((await leadClient.post('/api/invitations').send({ email, role: 'clinician' })).status).toBe(201);
    const invite = mail.tokenFrom(mail.lastTo(email), '/accept-invitation');
    secrets.push(invite, password);

    const anon = await anonymousClient(app);
    const accepted = await anon.post('/api/invitations/accept').send({ token: invite, name: 'Ola', password });
    expect(accepted.status).toBe(200);
    secrets.push(sidOf(accepted)!);
    await anon.refreshCsrf();
    expect((await anon.post('/api/invitations/accept').send({ token: invite, name: 'Ola', password })).status).toBe(
      410,
    );

    const again = await anonymousClient(app);
    const login = await again.post('/api/auth/login').send({ email, password });
    secrets.push(sidOf(login)!);
    await again.refreshCsrf();
    const wrong = await again.post('/api/auth/login').send({ email, password: `${password}-wrong` });
    expect(wrong.status).toBe(401);
    secrets.push(`${password}-wrong`);

    await anon.post('/api/auth/forgot').send({ email });
    const reset = mail.tokenFrom(await mail.waitFor(email, { subject: /password/ }), '/reset-password');
    const newPassword = 'Brand-New-Passphrase-3310';
    secrets.push(reset, newPassword);
    expect((await anon.post('/api/auth/reset').send({ token: reset, password: newPassword })).status).toBe(204);
    await anon.refreshCsrf(); // the reset ended this browser's session too
    expect((await anon.post('/api/auth/reset').send({ token: reset, password: newPassword })).status).toBe(410);
    expect((await anon.post('/api/auth/reset').send({ token: reset, password: 'short' })).status).toBe(422);

    // the relay refusing an invitation is logged, without the link
    failNext = true;
    const failed = await leadClient
      .post('/api/invitations')
      .send({ email: `fail-${Date.now()}@test.loadline.test`, role: 'clinician' });
    failNext = false;
    expect(failed.status).toBe(201);
    expect(failed.body.mailSent).toBe(false);
    expect(logs.join('\n')).toMatch(/invitation e-mail failed/);
    secrets.push(new URL(sentWhileFailing[0]!.text.match(/https?:\/\/\S+/)![0]).searchParams.get('token')!);

    const audit = (await database.db.execute(sql`select detail::text as d from audit_event`)).rows.map((r) =>
      String(r.d),
    );
    const haystacks = {
      logs: logs.join('\n'),
      responses: responses.join('\n'),
      console: printed.join('\n'),
      audit: audit.join('\n'),
    };
    expect(secrets.every((s) => typeof s === 'string' && s.length >= 12)).toBe(true);
    expect(responses.length).toBeGreaterThan(10);
    // positive controls: the capture does see what the app writes
    expect(haystacks.responses).toContain(email);
    expect(haystacks.responses).toContain('content-security-policy');
    for (const [where, text] of Object.entries(haystacks)) {
      for (const s of secrets) expect(text.includes(s), `${where} contains a secret`).toBe(false);
    }
  });
});
