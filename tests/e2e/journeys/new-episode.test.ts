import { randomBytes } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { assessments, clinics, episodes, users } from '../../../server/db/schema';
import { derivePseudonymKey, pseudonymFor } from '../../../shared/pseudonym';
import { DEMO_PASSPHRASE } from '../../../scripts/seed/load';
import { newPage, signIn, startE2eApp, type E2eApp, type E2ePage } from '../harness';

// Journey 2: the demo clinician enters a new episode through the form (the pseudonym is made in the browser from a
// local identifier and the clinic passphrase), adds the week-12 follow-up, and sees the change and the MCID flag.
let app: E2eApp;
let b: E2ePage;

beforeAll(async () => {
  app = await startE2eApp();
  b = await newPage(app);
});
afterAll(async () => {
  await b?.close();
  await app?.close();
});

const daysAgo = (d: number) => new Date(Date.now() - d * 86_400_000).toISOString().slice(0, 10);

describe('journey: a clinician records an episode and its week-12 follow-up', () => {
  it('form with a browser-made pseudonym → episode page → week-12 follow-up → change since the start and MCID reached', async () => {
    onTestFailed(() => b.saveArtifacts('journey-new-episode'));
    const { page } = b;
    b.allow(401, '/api/auth/me'); // signed out until the sign-in, by design
    await signIn(page, 'clinician@demo.loadline.test');
    const reference = `JT-${randomBytes(3).toString('hex').toUpperCase().replace(/\d/g, 'Q')}`;
    const localId = `C01-PT${randomBytes(2).toString('hex')}`;
    const start = daysAgo(90);

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Caseload' }).click();
    await page.getByRole('link', { name: 'New episode' }).click();
    await page.getByLabel('Clinic passphrase').fill(DEMO_PASSPHRASE);
    await page.getByRole('button', { name: 'Use passphrase' }).click();
    await page.getByLabel('Local patient identifier').fill(localId);
    await page.getByRole('button', { name: 'Make pseudonym' }).click();
    await expect.poll(() => page.getByText('Pseudonym ready').count(), { timeout: 30_000 }).toBe(1);

    const form = page.getByRole('form', { name: 'New episode' });
    await form.getByLabel('Episode reference').fill(reference);
    await form.getByLabel('First day of care').fill(start);
    await form.getByLabel('Affected heel').selectOption('right');
    await form.getByLabel('Weeks of symptoms before the start').fill('14');
    await form.getByLabel('Age in years').fill('47');
    await form.getByLabel('Sex').selectOption('female');
    await form.getByLabel('Height (cm)').fill('168');
    await form.getByLabel('Weight (kg)').fill('74.5');
    await form.getByLabel('Activity group').selectOption('active');
    await form.getByLabel('Stands for most of the working day').check();
    await form.getByLabel(/de-identified record may be used for research/).check();
    await form.getByLabel('Date of the assessment').fill(start);
    await form.getByLabel('Pain on first steps in the morning (0–10)').fill('7');
    await form.getByLabel('Foot and ankle function, daily living (0–100)').fill('52');
    await form.getByRole('button', { name: 'Save episode' }).click();
    await page.waitForURL(/\/episodes\/\d+$/);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(`Episode ${reference}`);

    // What reached the registry: the pseudonym the clinic itself would make, never the local identifier.
    const [clinician] = await app.db.select().from(users).where(eq(users.email, 'clinician@demo.loadline.test'));
    const [clinic] = await app.db.select().from(clinics).where(eq(clinics.id, clinician!.clinicId!));
    const [stored] = await app.db.select().from(episodes).where(and(eq(episodes.clinicId, clinic!.id), eq(episodes.reference, reference)));
    const expected = await pseudonymFor(await derivePseudonymKey(DEMO_PASSPHRASE, clinic!.pseudonymSalt!), localId);
    expect(stored!.pseudonym).toBe(expected);
    expect(JSON.stringify(stored)).not.toContain(localId.toUpperCase());
    expect(stored).toMatchObject({ startDate: start, ageYears: 47, weightKg: 74.5, standingWork: true, researchConsent: true });
    expect(Number(new URL(page.url()).pathname.split('/').at(-1))).toBe(stored!.id);

    const followUp = page.getByRole('form', { name: 'Add a follow-up' });
    await followUp.getByLabel('Which assessment').selectOption('week12');
    await followUp.getByLabel(/^Date\b/).fill(daysAgo(6));
    await followUp.getByLabel('Pain on first steps in the morning (0–10)').fill('3');
    await followUp.getByLabel('Foot and ankle function, daily living (0–100)').fill('60');
    await followUp.getByRole('button', { name: 'Save follow-up' }).click();
    await expect.poll(() => followUp.getByRole('status').textContent()).toContain('Week 12 saved');

    // The history: the week-12 row shows the sign-corrected change and whether it reaches each MCID.
    const history = page.getByRole('table', { name: 'Assessments and scores of this episode' });
    const week12 = history.getByRole('row').filter({ has: page.getByRole('rowheader', { name: /Week 12/ }) });
    const cells = week12.getByRole('cell');
    await expect.poll(() => cells.nth(1).textContent()).toContain('+4 since start');
    expect(await cells.nth(1).textContent()).toContain('reached MCID (2)'); // 7 → 3 on first-step pain, MCID 2
    expect(await cells.nth(2).textContent()).toContain('+8 since start');
    expect(await cells.nth(2).textContent()).toContain('reached MCID (8)'); // 52 → 60 on daily-living function, MCID 8
    const rows = await app.db.select().from(assessments).where(eq(assessments.episodeId, stored!.id));
    expect(rows.map((r) => r.timepoint).sort()).toEqual(['baseline', 'week12']);
    expect(b.problems()).toEqual([]);
  });
});
