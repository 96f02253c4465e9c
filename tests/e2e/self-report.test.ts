import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { assessments, scores, selfReportLinks } from '../../server/db/schema';
import { newPage, signIn, startE2eApp, type E2eApp, type E2ePage } from './harness';

// The self-report round trip in Chromium: the demo clinician makes a patient link on the Follow-ups screen; the
// patient opens it in another browser profile on a phone-sized screen, answers by touch target and keyboard, sends
// once; opening it again, or a tampered copy, is refused with a plain page and writes nothing.
let app: E2eApp;
let clinician: E2ePage;
let patient: E2ePage;

beforeAll(async () => {
  app = await startE2eApp();
  clinician = await newPage(app);
  await signIn(clinician.page, 'clinician@demo.loadline.test');
  clinician.clearProblems(); // signed out, /api/auth/me answers 401 by design
  patient = await newPage(app, { viewport: { width: 390, height: 844 } });
});

afterAll(async () => {
  await clinician?.close();
  await patient?.close();
  await app?.close();
});

const count = async (table: 'assessment' | 'score') =>
  ((await app.db.execute<{ n: number }>(sql.raw(`select count(*)::int as n from ${table}`))).rows[0] as { n: number }).n;

describe('patient self-report', () => {
  it('goes from the follow-ups screen to a patient answering once on a phone', async () => {
    onTestFailed(async () => {
      await clinician.saveArtifacts('self-report-clinician');
      await patient.saveArtifacts('self-report-patient');
    });
    const { page } = clinician;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Follow-ups' }).click();
    const table = page.getByRole('table', { name: 'Follow-ups of your clinic' });
    await table.getByRole('button', { name: /^Patient link/ }).first().waitFor({ timeout: 30_000 });
    // The demo is generated around the day it is loaded, so the screen has work on it.
    expect(await table.getByRole('button', { name: /^Patient link/ }).count()).toBeGreaterThan(0);
    await table.getByRole('button', { name: /^Patient link/ }).first().click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('button', { name: 'Make the link' }).click();
    const shown = dialog.getByTestId('self-report-url').getByRole('link');
    await shown.waitFor();
    const url = new URL((await shown.textContent())!);
    expect(url.pathname).toMatch(/^\/report\/[A-Za-z0-9_-]{43}$/);
    await dialog.getByRole('img', { name: /QR code of the patient link/ }).waitFor();
    await dialog.getByRole('button', { name: 'Done' }).click();
    expect(clinician.problems()).toEqual([]);

    const token = url.pathname.split('/').at(-1)!;
    const [link] = await app.db
      .select()
      .from(selfReportLinks)
      .where(eq(selfReportLinks.tokenHash, createHash('sha256').update(token).digest('hex')));
    expect(link!.usedAt).toBeNull();

    // The patient: no session, another browser profile, a phone-sized window.
    const p = patient.page;
    await p.goto(url.pathname);
    await expect.poll(() => p.getByRole('heading', { level: 1 }).textContent()).toMatch(/how is your heel\?/);
    expect(await p.getByRole('navigation').count()).toBe(0); // outside the app shell
    expect(await p.getByText(/do not replace your clinician/).count()).toBe(1);

    // First-step pain: a large button (a real radio in a labelled group) chosen by pointer.
    const pain = p.getByRole('group', { name: /first steps this morning/ });
    const three = pain.getByText('3', { exact: true });
    expect((await three.boundingBox())!.height).toBeGreaterThanOrEqual(44);
    await three.click();
    expect(await pain.getByRole('radio', { name: '3', exact: true }).isChecked()).toBe(true);

    // Global change by keyboard: arrow keys move within the group.
    const change = p.getByRole('group', { name: /Compared with when your care started/ });
    await change.getByRole('radio', { name: '0', exact: true }).focus();
    await p.keyboard.press('Space');
    await p.keyboard.press('ArrowRight');
    await p.keyboard.press('ArrowRight');
    expect(await change.getByRole('radio', { name: '+2', exact: true }).isChecked()).toBe(true);

    // A number out of range is caught on the page; nothing is sent.
    const before = { assessment: await count('assessment'), score: await count('score') };
    const steps = p.getByLabel(/steps a day/);
    await steps.fill('250000');
    await p.getByRole('button', { name: 'Send my answers' }).click();
    await expect.poll(() => p.getByText(/whole number of steps/).count()).toBe(1);
    expect(await count('assessment')).toBe(before.assessment);
    await steps.fill('5200');
    await p.getByRole('button', { name: 'Send my answers' }).click();
    await expect.poll(() => p.getByRole('heading', { name: /Thank you/ }).count(), { timeout: 15_000 }).toBe(1);
    expect(patient.problems()).toEqual([]);

    const [used] = await app.db.select().from(selfReportLinks).where(eq(selfReportLinks.id, link!.id));
    expect(used!.usedAt).not.toBeNull();
    const [stored] = await app.db.select().from(assessments).where(eq(assessments.id, used!.assessmentId!));
    expect(stored).toMatchObject({ episodeId: link!.episodeId, timepoint: link!.timepoint, reporter: 'patient', avgDailySteps: 5200 });
    const values = await app.db.select({ v: scores.value }).from(scores).where(eq(scores.assessmentId, stored!.id));
    expect(values.map((s) => s.v).sort((a, b) => a - b)).toEqual([2, 3]);
    expect({ assessment: await count('assessment'), score: await count('score') }).toEqual({
      assessment: before.assessment + 1,
      score: before.score + 2,
    });

    // The same link again: a friendly refusal, no form, nothing written.
    const after = { assessment: await count('assessment'), score: await count('score') };
    await p.goto(url.pathname);
    await expect.poll(() => p.getByRole('heading', { name: 'This link cannot take answers any more' }).count()).toBe(1);
    expect(await p.getByText(/already been used/).count()).toBe(1);
    expect(await p.getByRole('button', { name: 'Send my answers' }).count()).toBe(0);

    // A tampered copy: "does not work", nothing written.
    await p.goto(url.pathname.replace(/.$/, (c) => (c === 'A' ? 'B' : 'A')));
    await expect.poll(() => p.getByRole('heading', { name: 'This link does not work' }).count()).toBe(1);
    expect({ assessment: await count('assessment'), score: await count('score') }).toEqual(after);
  });
});
