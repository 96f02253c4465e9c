import { afterAll, beforeAll, inject } from 'vitest';
import { createApp, type AppDeps } from '../../server/app';
import { openDatabase } from '../../server/db/client';
import { startFakeSmtp, type FakeSmtp, type ReceivedMail } from '../../server/mail/fake-smtp';
import type { Mailer } from '../../server/mail/transport';

export type { ReceivedMail } from '../../server/mail/fake-smtp';

/** Starts a fake SMTP server on a random port; stop it in afterAll. `mail.mailer` goes into createApp. */
export function startTestMail(): Promise<FakeSmtp> {
  return startFakeSmtp({ port: 0, shareWithOutbox: true });
}

export type TestMail = {
  /** Sends to the fake server started in beforeAll; safe to hand to createApp at module level. */
  mailer: Mailer;
  messages(): ReceivedMail[];
  clear(): void;
  /** The newest message to `address` (throws when there is none). */
  lastTo(address: string): ReceivedMail;
  /**
   * Waits (polling, up to `timeoutMs`, default 5 s) until a message to `address` (and, when given,
   * with a matching subject) has arrived; returns the newest such message. For mail sent in the background.
   */
  waitFor(address: string, where?: { subject?: RegExp; timeoutMs?: number }): Promise<ReceivedMail>;
  /** The `token` query parameter of the first link in `m` whose path starts with `pathPrefix`. */
  tokenFrom(m: ReceivedMail, pathPrefix: string): string;
};

/** Registers beforeAll/afterAll hooks around a fake SMTP server for one test file. */
export function withFakeMail(): TestMail {
  let smtp: FakeSmtp | undefined;
  beforeAll(async () => {
    smtp = await startTestMail();
  });
  afterAll(() => smtp?.stop());
  const started = () => {
    if (!smtp) throw new Error('withFakeMail(): the fake SMTP server starts in beforeAll');
    return smtp;
  };
  return {
    mailer: { send: (m) => started().mailer.send(m) },
    messages: () => started().messages(),
    clear: () => started().clear(),
    lastTo(address) {
      const found = started()
        .messages()
        .filter((m) => m.to.includes(address.toLowerCase()));
      const last = found.at(-1);
      if (!last) throw new Error(`no e-mail to ${address} (got ${started().messages().length} messages)`);
      return last;
    },
    async waitFor(address, where = {}) {
      const deadline = Date.now() + (where.timeoutMs ?? 5000);
      for (;;) {
        const m = started()
          .messages()
          .filter((x) => x.to.includes(address.toLowerCase()) && (!where.subject || where.subject.test(x.subject)))
          .at(-1);
        if (m) return m;
        if (Date.now() > deadline) throw new Error(`no e-mail to ${address} within ${where.timeoutMs ?? 5000} ms`);
        await new Promise((r) => setTimeout(r, 25));
      }
    },
    tokenFrom(m, pathPrefix) {
      const link = m.links.find((l) => new URL(l).pathname.startsWith(pathPrefix));
      const token = link ? new URL(link).searchParams.get('token') : null;
      if (!token) throw new Error(`no ${pathPrefix} link with a token in "${m.subject}"`);
      return token;
    },
  };
}

/**
 * Like tests/setup/test-app.ts `testApp()`, with a fake mail server wired into the app:
 * `const ctx = testAppWithMail(); ... ctx.mail.lastTo(email)`.
 */
export function testAppWithMail(extra: Partial<AppDeps> = {}) {
  const mail = withFakeMail();
  const database = openDatabase(inject('databaseUrl'), 5);
  const logs: string[] = [];
  const app = createApp({ ...database, log: (m) => logs.push(m), mailer: mail.mailer, ...extra });
  afterAll(() => database.pool.end());
  return { ...database, app, logs, mail };
}
