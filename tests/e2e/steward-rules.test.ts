import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { eq } from 'drizzle-orm';
import { users } from '../../server/db/schema';
import { updateRules } from '../../server/services/admin/rules';
import { currentRules, type VersionedRules } from '../../server/services/rules.service';
import { newPage, signIn, startE2eApp, type E2eApp, type E2ePage } from './harness';

// The steward changes the recovery threshold in the Registry console; Clinic results then names the new version.
let app: E2eApp;
let b: E2ePage;
let before: VersionedRules;
let stewardId: number;

beforeAll(async () => {
  app = await startE2eApp();
  before = await currentRules(app.db);
  const [s] = await app.db.select({ id: users.id }).from(users).where(eq(users.email, 'steward@demo.loadline.test'));
  stewardId = s!.id;
  b = await newPage(app);
  await signIn(b.page, 'steward@demo.loadline.test');
  b.clearProblems(); // signed out, /api/auth/me answers 401 by design
});

afterAll(async () => {
  // Later browser tests of the run expect the demo's rules: store them again as a newer version.
  const now = await currentRules(app.db);
  if (JSON.stringify(now.rules) !== JSON.stringify(before.rules)) {
    await updateRules(app.db, { kind: 'registry', researcher: false, userId: stewardId }, { rules: before.rules, reason: 'Browser test puts the earlier rules back' });
  }
  await b?.close();
  await app?.close();
});

describe('steward changes a registry rule', () => {
  it('saves a stricter recovery threshold with a reason; the history and Clinic results name the new version', async () => {
    onTestFailed(() => b.saveArtifacts('steward-rules'));
    const { page } = b;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Registry console' }).click();
    await page.getByRole('navigation', { name: 'Console sections' }).getByRole('link', { name: 'Rules' }).click();
    await expect.poll(() => page.getByRole('heading', { name: `In force: version ${before.version}` }).count()).toBe(1);

    const threshold = page.getByLabel('Recovery threshold');
    expect(await threshold.inputValue()).toBe(String(before.rules.recovery.threshold));
    const next = before.rules.recovery.threshold - 1;
    await threshold.fill(String(next));
    // Without a reason the form refuses, next to the field, and nothing is sent.
    await page.getByRole('button', { name: 'Save as a new version' }).click();
    await expect.poll(() => page.getByText('Enter the reason for the change').count()).toBe(1);
    expect((await currentRules(app.db)).version).toBe(before.version);

    await page.getByLabel(/Why this change/).fill('Pilot of a stricter recovery definition');
    const saved = page.waitForResponse((r) => r.url().endsWith('/api/admin/rules') && r.request().method() === 'PUT');
    await page.getByRole('button', { name: 'Save as a new version' }).click();
    expect((await saved).status()).toBe(200);
    const stored = await currentRules(app.db);
    expect(stored.version).toBeGreaterThan(before.version);
    expect(stored.rules.recovery.threshold).toBe(next);
    await expect.poll(() => page.getByRole('heading', { name: `In force: version ${stored.version}` }).count()).toBe(1);
    const history = page.getByRole('list', { name: 'Versions of the registry rules' });
    const newest = history.getByRole('listitem').first();
    expect(await newest.textContent()).toContain('Pilot of a stricter recovery definition');
    expect(await newest.textContent()).toContain(`Recovery threshold: ${before.rules.recovery.threshold} → ${next}`);
    expect(await newest.textContent()).toContain('Ilse Marchetti');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Clinic results' }).click();
    await expect.poll(() => page.getByTestId('meta-line').textContent(), { timeout: 60_000 }).toContain(`registry rules version ${stored.version}`);
    expect(await page.getByText(`at or below ${next}.`).count()).toBeGreaterThan(0);
    expect(b.problems()).toEqual([]);
  });
});
