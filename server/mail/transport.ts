import nodemailer from 'nodemailer';
import { env } from '../env';

/** One outgoing e-mail: always a plain-text and an HTML part. Never put health data in one. */
export type MailMessage = { to: string; subject: string; text: string; html: string };
export type Mailer = { send(msg: MailMessage): Promise<void> };

export type MailerOptions = {
  host: string;
  port: number;
  user?: string;
  password?: string;
  from?: string;
  /** The local fake server offers no TLS; a real relay on 587 must. */
  ignoreTLS?: boolean;
};

/** A mailer sending through SMTP with nodemailer. */
export function createMailer(opts: MailerOptions): Mailer {
  const transport = nodemailer.createTransport({
    host: opts.host,
    port: opts.port,
    secure: opts.port === 465,
    ignoreTLS: opts.ignoreTLS ?? false,
    auth: opts.user ? { user: opts.user, pass: opts.password ?? '' } : undefined,
    connectionTimeout: 10_000,
  });
  const from = opts.from ?? env().MAIL_FROM;
  return {
    async send(msg) {
      await transport.sendMail({ from, to: msg.to, subject: msg.subject, text: msg.text, html: msg.html });
    },
  };
}

let configured: Mailer | undefined;

/** Points the process-wide mailer somewhere (the fake SMTP server in development); undefined resets it. */
export function setMailer(m: Mailer | undefined): void {
  configured = m;
}

class MailNotConfiguredError extends Error {}

/**
 * The process-wide mailer: the one set by `setMailer` (development: the fake server), else SMTP from
 * the environment (SMTP_HOST/SMTP_PORT/...). Resolved at send time, so an app built before the fake
 * server started still reaches it.
 */
export function mailer(): Mailer {
  return {
    send(msg) {
      if (configured) return configured.send(msg);
      const e = env();
      if (!e.SMTP_HOST) {
        return Promise.reject(new MailNotConfiguredError('No mail server configured: set SMTP_HOST and SMTP_PORT'));
      }
      configured = createMailer({
        host: e.SMTP_HOST,
        port: e.SMTP_PORT ?? 587,
        user: e.SMTP_USER,
        password: e.SMTP_PASSWORD,
      });
      return configured.send(msg);
    },
  };
}
