import { readFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import { desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { dataRequests, exportLog } from '../../../server/db/schema';
import { newPage, signIn, startE2eApp, type E2eApp, type E2ePage } from '../harness';

// Journey 5: the demo researcher builds and saves a cohort, asks for its data; the steward approves in another
// browser; the researcher downloads the de-identified CSV, which parses and matches what the export log recorded.
let app: E2eApp;
let researcher: E2ePage;
let steward: E2ePage;

beforeAll(async () => {
  app = await startE2eApp();
  researcher = await newPage(app);
  steward = await newPage(app);
});
afterAll(async () => {
  await researcher?.close();
  await steward?.close();
  await app?.close();
});

describe('journey: cohort → data request → approval → download', () => {
  it('the researcher downloads a CSV that parses, with no identifiers, after the steward approves', async () => {
    onTestFailed(async () => {
      await researcher.saveArtifacts('journey-cohort-researcher');
      await steward.saveArtifacts('journey-cohort-steward');
    });
    researcher.allow(401, '/api/auth/me'); // signed out until the sign-in, by design
    steward.allow(401, '/api/auth/me');
    const name = `Runners, journey ${randomBytes(2).toString('hex')}`;
    const r = researcher.page;
    await signIn(r, 'researcher@demo.loadline.test');

    // Build: runners only; the live preview counts them.
    await r.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cohorts' }).click();
    await r.getByRole('link', { name: 'New cohort' }).click();
    const criteria = r.getByRole('form', { name: 'Cohort criteria' });
    const counted = r.waitForResponse((x) => x.url().endsWith('/api/cohorts/preview') && x.status() === 200);
    await criteria.getByRole('group', { name: /Activity profile/ }).getByText('Runners').click();
    const preview = (await (await counted).json()) as { count: number | string };
    expect(typeof preview.count === 'number' ? preview.count : 0).toBeGreaterThan(10);
    const save = r.getByRole('form', { name: 'Save the cohort' });
    await save.getByLabel('Name').fill(name);
    await save.getByLabel('Description').fill('Runners of the demo registry, for a browser journey');
    await save.getByRole('button', { name: 'Save cohort' }).click();
    await r.waitForURL(/\/cohorts\/\d+$/);
    await expect.poll(() => r.getByRole('heading', { level: 1 }).textContent()).toBe(name);

    // Request its data.
    await r.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Data requests' }).click();
    const ask = r.getByRole('form', { name: 'Request the data of a cohort' });
    await ask.getByLabel('Cohort').selectOption({ label: `${name} (version 1)` });
    await ask.getByLabel('Purpose').fill('Time to recovery of runners compared with the registry as a whole');
    await ask.getByRole('button', { name: 'Send request' }).click();
    await expect.poll(() => ask.getByRole('status').textContent()).toContain('Request sent to the steward');
    const [request] = await app.db.select().from(dataRequests).orderBy(desc(dataRequests.id)).limit(1);
    expect(request).toMatchObject({ status: 'pending', purpose: 'Time to recovery of runners compared with the registry as a whole' });
    const card = (p: typeof r) => p.getByRole('article', { name: `Request ${request!.id}` });
    expect(await card(r).getByRole('link', { name: 'Download the CSV' }).count()).toBe(0); // not before approval

    // The steward approves with the default conditions.
    const s = steward.page;
    await signIn(s, 'steward@demo.loadline.test');
    await s.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Data requests' }).click();
    const decided = s.waitForResponse((x) => x.url().endsWith(`/api/data-requests/${request!.id}/approve`));
    await card(s).getByRole('button', { name: 'Approve' }).click();
    expect((await decided).status()).toBe(200);
    expect(steward.problems()).toEqual([]);

    // The researcher sees the download and saves the file.
    await r.reload();
    const link = card(r).getByRole('link', { name: 'Download the CSV' });
    await link.waitFor({ timeout: 30_000 });
    const [download] = await Promise.all([r.waitForEvent('download'), link.click()]);
    const text = readFileSync((await download.path())!, 'utf8');
    const rows = parse(text, { columns: true, skip_empty_lines: true }) as Record<string, string>[];
    const [logged] = await app.db.select().from(exportLog).where(eq(exportLog.requestId, request!.id));
    expect(logged).toMatchObject({ status: 'completed', rowCount: rows.length });
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.length).toBeLessThanOrEqual(preview.count as number); // small groups may be left out, never added
    const header = Object.keys(rows[0]!);
    expect(header).toContain('study_id');
    expect(header.some((h) => /pseudonym|reference|email|name/i.test(h))).toBe(false);
    expect(new Set(rows.map((x) => x.activity_profile))).toEqual(new Set(['runner']));
    expect(researcher.problems()).toEqual([]);
  });
});
