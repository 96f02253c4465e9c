import type { Mailer, MailMessage } from './transport';

/**
 * Sends and reports success instead of throwing: the account change is already saved, and a failed
 * e-mail must not lose it (the invitation can be resent). The log line names no address and no link.
 */
export async function sendOrLog(
  mailer: Mailer,
  msg: MailMessage,
  what: string,
  log: (m: string) => void,
): Promise<boolean> {
  try {
    await mailer.send(msg);
    return true;
  } catch (e) {
    log(`mail: sending the ${what} e-mail failed: ${e instanceof Error ? e.message : String(e)}`);
    return false;
  }
}
