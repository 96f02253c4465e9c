import { and, eq, inArray, isNotNull } from 'drizzle-orm';
import cron, { type ScheduledTask } from 'node-cron';
import { todayUtc } from '../../shared/follow-up-schedule';
import type { Db } from '../db/client';
import { clinics, reminderDigests, users } from '../db/schema';
import { env } from '../env';
import type { Mailer } from '../mail/transport';
import { audit } from '../services/audit';
import { followUpsOfClinic } from '../services/follow-ups.service';
import { currentRules } from '../services/rules.service';
import { digestMail } from './reminders-mail';

export type ReminderRun = { day: string; sent: number; alreadySent: number; nothingDue: number; failed: number };
export type ReminderOptions = { day?: string; appUrl?: string; log?: (m: string) => void };

const SETTINGS_NOTE =
  'You get this because daily reminders are on. Turn them off with the switch on the follow-ups screen.';

/**
 * Sends each active clinician and lead (not opted out) one digest of their clinic's due and closing follow-ups
 * for `day`. Idempotent per day: the `reminder_digest` row is the decision to send, committed before sending;
 * if sending fails the row is deleted again, so a later run retries that person and nobody gets two.
 */
export async function runReminderDigests(db: Db, mailer: Mailer, opts: ReminderOptions = {}): Promise<ReminderRun> {
  const day = opts.day ?? todayUtc();
  const log = opts.log ?? (() => undefined);
  const base = opts.appUrl ?? env().APP_URL ?? `http://${env().HOST}:${env().PORT}`;
  const screenUrl = new URL('/follow-ups', base).toString();
  const { rules } = await currentRules(db);
  const recipients = await db
    .select({ id: users.id, email: users.email, clinicId: users.clinicId, clinicName: clinics.displayName })
    .from(users)
    .innerJoin(clinics, eq(clinics.id, users.clinicId))
    .where(
      and(
        eq(users.active, true),
        eq(users.digestOptOut, false),
        isNotNull(users.passwordHash), // invitation accepted: someone is there to read it
        inArray(users.role, ['lead', 'clinician']),
        eq(clinics.active, true),
      ),
    )
    .orderBy(users.id);

  const run: ReminderRun = { day, sent: 0, alreadySent: 0, nothingDue: 0, failed: 0 };
  const byClinic = new Map<number, Awaited<ReturnType<typeof followUpsOfClinic>>>();
  for (const r of recipients) {
    const clinicId = r.clinicId!;
    if (!byClinic.has(clinicId))
      byClinic.set(clinicId, await followUpsOfClinic(db, clinicId, day, rules.followUpWindows, ['due', 'closing']));
    const items = byClinic.get(clinicId)!;
    if (items.length === 0) {
      run.nothingDue += 1;
      continue;
    }
    const closingCount = items.filter((i) => i.state === 'closing').length;
    const claimed = await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(reminderDigests)
        .values({ userId: r.id, day, dueCount: items.length - closingCount, closingCount })
        .onConflictDoNothing()
        .returning({ id: reminderDigests.id });
      if (!row) return null;
      await audit(tx, {
        actorId: null,
        clinicId,
        action: 'send',
        entity: 'reminder-digest',
        entityId: row.id,
        detail: { userId: r.id, day },
      });
      return row;
    });
    if (!claimed) {
      run.alreadySent += 1;
      continue;
    }
    try {
      await mailer.send(digestMail(r.email, r.clinicName, day, items, screenUrl, SETTINGS_NOTE));
      run.sent += 1;
    } catch (e) {
      await db.transaction(async (tx) => {
        await tx.delete(reminderDigests).where(eq(reminderDigests.id, claimed.id));
        await audit(tx, {
          actorId: null,
          clinicId,
          action: 'delete',
          entity: 'reminder-digest',
          entityId: claimed.id,
          detail: { userId: r.id, day, reason: 'send-failed' },
        });
      });
      run.failed += 1;
      log(
        `reminders: the digest for user ${r.id} could not be sent (${e instanceof Error ? e.message : String(e)}); a later run retries`,
      );
    }
  }
  return run;
}

/** Every day at 06:00 server time, inside the server process (started by startServer, never by createApp). */
export const REMINDER_CRON = '0 6 * * *';

export function scheduleReminderDigests(db: Db, mailer: Mailer, log: (m: string) => void): ScheduledTask {
  return cron.schedule(
    REMINDER_CRON,
    async () => {
      try {
        const r = await runReminderDigests(db, mailer, { log });
        log(
          `reminders ${r.day}: ${r.sent} sent, ${r.alreadySent} already sent, ${r.nothingDue} with nothing due, ${r.failed} failed`,
        );
      } catch (e) {
        log(`reminders: the daily run failed: ${e instanceof Error ? e.message : String(e)}`);
      }
    },
    { name: 'reminder-digests', noOverlap: true },
  );
}
