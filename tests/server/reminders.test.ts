import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, inArray } from 'drizzle-orm';
import { testApp } from '../setup/test-app';
import { withFakeMail } from '../setup/mail';
import { createUser } from '../setup/auth';
import { reminderDigests, users } from '../../server/db/schema';
import { runReminderDigests } from '../../server/jobs/reminders';
import type { Mailer } from '../../server/mail/transport';
import { addDays } from '../../shared/follow-up-schedule';
import { daysAgo, makeClinic, makeEpisode, today } from './follow-ups-fixtures';

const ctx = testApp();
const mail = withFakeMail();
afterAll(() => ctx.close());

const people: Record<string, { id: number; email: string }> = {};
const pseudonyms: string[] = [];
const APP_URL = 'http://loadline.example.test';

beforeAll(async () => {
  const clinic = await makeClinic(ctx.db, 'Reminder clinic');
  const quiet = await makeClinic(ctx.db, 'Quiet clinic');
  // Distinctive score values, so a leak into the e-mail would be seen.
  const spec = (startDaysAgo: number, reference: string) => ({
    startDate: daysAgo(startDaysAgo),
    reference,
    assessments: [
      {
        timepoint: 'baseline' as const,
        assessedOn: daysAgo(startDaysAgo),
        scores: { 'nprs-first-step': 9, 'faam-adl': 63.7, lefs: 41 },
      },
    ],
  });
  pseudonyms.push((await makeEpisode(ctx.db, clinic.id, spec(40, 'RM-DUE-1'))).pseudonym); // week 6 due
  pseudonyms.push((await makeEpisode(ctx.db, clinic.id, spec(108, 'RM-CLOSE-1'))).pseudonym); // week 12 closing
  await makeEpisode(ctx.db, clinic.id, spec(10, 'RM-EARLY')); // nothing due yet
  people.lead = await createUser(ctx.db, 'lead', clinic.id);
  people.clinician = await createUser(ctx.db, 'clinician', clinic.id);
  people.optedOut = await createUser(ctx.db, 'clinician', clinic.id);
  await ctx.db.update(users).set({ digestOptOut: true }).where(eq(users.id, people.optedOut.id));
  people.inactive = await createUser(ctx.db, 'clinician', clinic.id);
  await ctx.db.update(users).set({ active: false }).where(eq(users.id, people.inactive.id));
  people.quiet = await createUser(ctx.db, 'clinician', quiet.id);
});

const mine = () => Object.values(people).map((p) => p.email);
const digestsFor = (day: string) =>
  ctx.db
    .select({ userId: reminderDigests.userId, due: reminderDigests.dueCount, closing: reminderDigests.closingCount })
    .from(reminderDigests)
    .where(
      and(
        eq(reminderDigests.day, day),
        inArray(
          reminderDigests.userId,
          Object.values(people).map((p) => p.id),
        ),
      ),
    );

describe('daily reminder digests', () => {
  it('sends one digest per active, opted-in clinic member with something due, even when run twice', async () => {
    mail.clear();
    const first = await runReminderDigests(ctx.db, mail.mailer, { day: today(), appUrl: APP_URL });
    const second = await runReminderDigests(ctx.db, mail.mailer, { day: today(), appUrl: APP_URL });
    expect(first.sent).toBeGreaterThanOrEqual(2);
    expect(second.sent).toBe(0);
    expect(second.alreadySent).toBe(first.sent);
    const received = mail.messages().filter((m) => m.to.some((t) => mine().includes(t)));
    expect(received.map((m) => m.to[0]).sort()).toEqual([people.lead!.email, people.clinician!.email].sort());
    const rows = await digestsFor(today());
    expect(rows.map((r) => r.userId).sort()).toEqual([people.lead!.id, people.clinician!.id].sort());
    expect(rows.every((r) => r.due === 1 && r.closing === 1)).toBe(true);
  });

  it('lists counts and episode references only, never a score', () => {
    const m = mail.lastTo(people.clinician!.email);
    expect(m.text).toContain('1 follow-up closing within 7 days and 1 more due');
    expect(m.text).toContain('RM-CLOSE-1');
    expect(m.text).toContain('RM-DUE-1');
    expect(m.text).not.toContain('RM-EARLY');
    expect(m.links).toContain(`${APP_URL}/follow-ups`);
    for (const body of [m.text, m.html, m.subject]) {
      expect(body).not.toMatch(/63\.7|\b41\b|\b9\s*\/\s*10/);
      expect(body).not.toMatch(/\d+(\.\d+)?\s*(%|points?\b|\/\s*10\b)/i);
      expect(body).not.toMatch(/nprs|faam|lefs|score|pain/i);
      for (const p of pseudonyms) expect(body).not.toContain(p);
    }
  });

  it('deletes the decision when sending fails, so a later run sends it exactly once', async () => {
    const day = addDays(today(), 1);
    const failing: Mailer = {
      send: (m) =>
        m.to === people.clinician!.email ? Promise.reject(new Error('relay refused')) : mail.mailer.send(m),
    };
    const logs: string[] = [];
    mail.clear();
    const first = await runReminderDigests(ctx.db, failing, { day, appUrl: APP_URL, log: (l) => logs.push(l) });
    expect(first.failed).toBe(1);
    expect(logs.join('\n')).toMatch(/could not be sent/);
    expect(logs.join('\n')).not.toContain(people.clinician!.email);
    expect((await digestsFor(day)).map((r) => r.userId)).toEqual([people.lead!.id]);

    const retry = await runReminderDigests(ctx.db, mail.mailer, { day, appUrl: APP_URL });
    expect(retry.failed).toBe(0);
    const toClinician = mail.messages().filter((m) => m.to.includes(people.clinician!.email));
    const toLead = mail.messages().filter((m) => m.to.includes(people.lead!.email));
    expect([toClinician.length, toLead.length]).toEqual([1, 1]);
    expect((await digestsFor(day)).map((r) => r.userId).sort()).toEqual([people.lead!.id, people.clinician!.id].sort());
  });
});
