import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { AddressInfo } from 'node:net';
import { createMailer, type Mailer } from './transport';
import { devOutbox, linksIn, type ReceivedMail } from './outbox';

export type { ReceivedMail } from './outbox';

export type FakeSmtp = {
  host: string;
  port: number;
  /** A mailer that sends to this server. */
  mailer: Mailer;
  /** Received messages, oldest first. */
  messages(): ReceivedMail[];
  clear(): void;
  stop(): Promise<void>;
};

export type FakeSmtpOptions = {
  /** 0 (default) picks a free port. */
  port?: number;
  /** Also put messages in the process-wide outbox that GET /api/dev/outbox shows (default true). */
  shareWithOutbox?: boolean;
};

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  const list = a === undefined ? [] : Array.isArray(a) ? a : [a];
  return list.flatMap((o) => o.value.map((v) => (v.address ?? '').toLowerCase())).filter(Boolean);
}

/**
 * A local SMTP server on 127.0.0.1 that accepts every message, parses it and keeps it in memory.
 * It stands in for a hosted mail relay in development and tests; it never relays anything.
 */
export async function startFakeSmtp(opts: FakeSmtpOptions = {}): Promise<FakeSmtp> {
  const received: ReceivedMail[] = [];
  let nextId = 1;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    banner: 'Loadline local mail catcher',
    size: 1024 * 1024,
    onData(stream, _session, callback) {
      // The message is stored before the client hears "250", so a resolved send() means it is readable.
      simpleParser(stream)
        .then((parsed) => {
          const text = parsed.text ?? '';
          const html = typeof parsed.html === 'string' ? parsed.html : '';
          const mail: ReceivedMail = {
            id: nextId++,
            to: addresses(parsed.to),
            from: addresses(parsed.from)[0] ?? '',
            subject: parsed.subject ?? '',
            text,
            html,
            links: linksIn(text, html),
            receivedAt: new Date().toISOString(),
          };
          received.push(mail);
          if (opts.shareWithOutbox ?? true) devOutbox.add(mail);
          callback();
        })
        .catch((e: unknown) => callback(e instanceof Error ? e : new Error(String(e))));
    },
  });
  server.on('error', () => undefined);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? 0, '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    host: '127.0.0.1',
    port,
    mailer: createMailer({ host: '127.0.0.1', port, ignoreTLS: true }),
    messages: () => [...received],
    clear: () => {
      received.length = 0;
    },
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
