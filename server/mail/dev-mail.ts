import { env } from '../env';
import { startFakeSmtp, type FakeSmtp } from './fake-smtp';
import { setMailer } from './transport';

/**
 * Outside production, when no SMTP_HOST is configured, mail goes to a local fake server whose
 * messages the steward's Outbox screen shows. Returns the server (to stop it) or null.
 */
export async function startDevMail(): Promise<FakeSmtp | null> {
  const e = env();
  if (e.NODE_ENV === 'production' || e.SMTP_HOST) return null;
  const smtp = await startFakeSmtp({ port: e.SMTP_PORT ?? 0 });
  setMailer(smtp.mailer);
  return smtp;
}
