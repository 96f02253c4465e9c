import { randomBytes } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { users } from '../../../server/db/schema';
import { csv, episodeRows } from '../../server/uploads-fixtures';
import { newPage, signIn, startE2eApp, type E2eApp, type E2ePage } from '../harness';

// Journey 3: a clinic lead checks a CSV with mistakes, sees each problem by row and column while nothing is
// written, corrects the file, checks it again and saves it; the rows then exist, once.
let app: E2eApp;
let b: E2ePage;
let clinicId: number;

beforeAll(async () => {
  app = await startE2eApp();
  b = await newPage(app);
  const [lead] = await app.db.select().from(users).where(eq(users.email, 'lead@demo.loadline.test'));
  clinicId = lead!.clinicId!;
});
afterAll(async () => {
  await b?.close();
  await app?.close();
});

/** The clinic's stored rows, straight from the database. */
async function counts() {
  const r = await app.db.execute<{ episodes: number; assessments: number; scores: number; uploads: number; audits: number }>(sql`select
    (select count(*)::int from episode where clinic_id = ${clinicId}) as episodes,
    (select count(*)::int from assessment a join episode e on e.id = a.episode_id where e.clinic_id = ${clinicId}) as assessments,
    (select count(*)::int from score s join assessment a on a.id = s.assessment_id join episode e on e.id = a.episode_id where e.clinic_id = ${clinicId}) as scores,
    (select count(*)::int from upload where clinic_id = ${clinicId}) as uploads,
    (select count(*)::int from audit_event where clinic_id = ${clinicId}) as audits`);
  return r.rows[0]!;
}

describe('journey: a CSV upload with mistakes, then corrected', () => {
  it('shows every problem by row and column and saves nothing; the corrected file saves', async () => {
    onTestFailed(() => b.saveArtifacts('journey-csv-upload'));
    const { page } = b;
    b.allow(401, '/api/auth/me'); // signed out until the sign-in, by design
    b.allow(422, '/api/uploads/episodes'); // the check of the file with mistakes answers 422 with its report
    await signIn(page, 'lead@demo.loadline.test');
    const tag = randomBytes(3).toString('hex').toUpperCase().replace(/\d/g, 'K');
    const good = [...episodeRows(`UP-${tag}A`, 2), ...episodeRows(`UP-${tag}B`, 2)];
    const bad = good.map((r) => ({ ...r }));
    bad[1]!.score_nprs_first_step = '12'; // line 3: outside 0–10
    bad[3]!.side = 'middle'; // line 5: not a side
    bad[4]!.side = 'middle'; // (the episode columns repeat, so every row of the episode says it)
    bad[5]!.side = 'middle';
    bad[2]!.assessed_on = '2025-02-30'; // line 4: no such day

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Upload' }).click();
    const before = await counts();
    const apiTotal = async () => (await (await page.request.get('/api/uploads')).json()).total as number;
    const uploadsBefore = await apiTotal();

    await page.getByLabel('CSV file').setInputFiles({ name: 'visits-with-mistakes.csv', mimeType: 'text/csv', buffer: Buffer.from(csv(bad)) });
    const checked = page.waitForResponse((r) => r.url().includes('/api/uploads/episodes?dryRun=1'));
    await page.getByRole('button', { name: 'Check file' }).click();
    expect((await checked).status()).toBe(422);
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Nothing was saved' }).count()).toBe(1);
    const problems = page.getByRole('table', { name: 'Problems found in the file' });
    const rows = await problems.locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.children].map((c) => (c.textContent ?? '').trim())));
    const where = rows.map(([row, column]) => `${row}:${column}`);
    expect(where).toContain('3:score_nprs_first_step');
    expect(where).toContain('5:side');
    expect(where).toContain('4:assessed_on');
    expect(rows.find((r) => r[1] === 'score_nprs_first_step')![2]).toMatch(/0 to 10; 12 is outside/);
    expect(await page.getByText('Rows rejected').locator('..').locator('dd').textContent()).toBe('5'); // lines 3 to 7
    expect(await page.getByRole('button', { name: 'Submit' }).isDisabled()).toBe(true);
    // Nothing written: the database and the API agree.
    expect(await counts()).toEqual(before);
    expect(await apiTotal()).toBe(uploadsBefore);

    // The corrected file: a clean check first (still nothing written), then the save.
    await page.getByLabel('CSV file').setInputFiles({ name: 'visits-corrected.csv', mimeType: 'text/csv', buffer: Buffer.from(csv(good)) });
    await page.getByRole('button', { name: 'Check file' }).click();
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Every row is valid' }).count()).toBe(1);
    expect(await page.getByText('Submitting would create 2 episodes and 6 assessments').count()).toBe(1);
    expect(await counts()).toEqual(before);
    const saved = page.waitForResponse((r) => r.url().includes('/api/uploads/episodes?dryRun=0'));
    await page.getByRole('button', { name: 'Submit' }).click();
    expect((await saved).status()).toBe(200);
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'The file was saved.' }).count()).toBe(1);
    const after = await counts();
    expect(after).toMatchObject({
      episodes: before.episodes + 2,
      assessments: before.assessments + 6,
      uploads: before.uploads + 1,
      audits: before.audits + 1, // one audit event for the whole upload
    });
    expect(after.scores - before.scores).toBe(2 * (3 + 4 + 4)); // baseline 3 scores; weeks 6 and 12 add the GROC
    expect(await apiTotal()).toBe(uploadsBefore + 1);
    const earlier = page.getByRole('table', { name: 'Earlier uploads' });
    await expect.poll(() => earlier.getByRole('cell', { name: 'visits-corrected.csv' }).count()).toBe(1);
    expect(b.problems()).toEqual([]);
  });
});
