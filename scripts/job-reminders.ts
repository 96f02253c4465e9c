/**
 * `npm run job:reminders`: one run of the daily reminder digests, for a scheduler outside the server
 * (the server also runs it every morning). Safe to repeat: nobody gets a second digest for the same day.
 * Without SMTP_HOST outside production, mail goes to a temporary local fake server and is listed here.
 */
import { openDatabase } from '../server/db/client';
import { migrateDatabase } from '../server/db/migrate';
import { env } from '../server/env';
import { runReminderDigests } from '../server/jobs/reminders';
import { startDevMail } from '../server/mail/dev-mail';
import { mailer } from '../server/mail/transport';
import { APP_DATABASE, createDatabase, ensurePostgres } from './db';
import { fail } from './lib-setup';

async function main(): Promise<void> {
  const url = env().DATABASE_URL ?? (await createDatabase(await ensurePostgres(), APP_DATABASE));
  const database = openDatabase(url, 2);
  const devMail = await startDevMail();
  try {
    await migrateDatabase(database.db);
    const run = await runReminderDigests(database.db, mailer(), { log: (m) => console.error(m) });
    console.log(
      `reminders ${run.day}: ${run.sent} sent, ${run.alreadySent} already sent today, ${run.nothingDue} with nothing due, ${run.failed} failed`,
    );
    if (devMail && devMail.messages().length > 0) {
      console.log('No SMTP_HOST set: the digests went to a temporary local mail catcher (not delivered):');
      for (const m of devMail.messages()) console.log(`  to ${m.to.join(', ')}: ${m.subject}`);
    }
    if (run.failed > 0) process.exitCode = 1;
  } finally {
    await devMail?.stop();
    await database.pool.end();
  }
}

main().catch(fail);
