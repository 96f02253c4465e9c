import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import type { Page } from 'playwright-core';
import { sql } from 'drizzle-orm';
import {
  ClinicsResponseSchema,
  OutcomesResponseSchema,
  RecoveryResponseSchema,
  AddOnsResponseSchema,
  TrajectoryResponseSchema,
  type OutcomesResponse,
} from '../../shared/schemas/analytics';
import { newPage, signIn, startE2eApp, type E2eApp, type E2ePage } from './harness';

// The four outcome dashboards in Chromium, signed in as the demo lead, under the app's real CSP.
let app: E2eApp;
let b: E2ePage;
const scripts: string[] = [];
beforeAll(async () => {
  app = await startE2eApp();
  b = await newPage(app);
  b.page.on('request', (r) => {
    if (r.resourceType() === 'script') scripts.push(r.url());
  });
  await signIn(b.page, 'lead@demo.loadline.test');
  b.clearProblems(); // signed out, /api/auth/me answers 401 by design
});
afterAll(async () => {
  await b?.close();
  await app?.close();
});

/** Opens a screen and returns the analytics answer the page itself received. */
async function open<T>(page: Page, path: string, api: string, parse: (x: unknown) => T): Promise<T> {
  const answer = page.waitForResponse((r) => new URL(r.url()).pathname === api && r.status() === 200, {
    timeout: 60_000,
  });
  await page.goto(path);
  return parse(await (await answer).json());
}

/** The chart inside a frame has drawn an SVG with marks of the given kinds. */
async function expectMarks(page: Page, testId: string, kinds: string[]) {
  const frame = page.getByTestId(testId);
  await frame.locator('svg').first().waitFor({ timeout: 60_000 });
  for (const kind of kinds) {
    const n = await frame
      .locator(`svg g.mark-${kind} > path, svg g.mark-${kind} > line, svg g.mark-${kind} > text`)
      .count();
    expect(n, `${testId}: ${kind} marks`).toBeGreaterThan(0);
  }
}

/** Opens the chart's data table and returns its body rows as text cells. */
async function tableRows(page: Page, testId: string): Promise<string[][]> {
  const frame = page.getByTestId(testId);
  await frame.getByRole('button', { name: 'Show data table' }).click();
  const rows = frame.locator('[data-chart-table] tbody tr');
  return rows.evaluateAll((trs) => trs.map((tr) => [...tr.children].map((c) => (c.textContent ?? '').trim())));
}

const pct = (v: number | null | undefined) => (v === null || v === undefined ? '–' : `${Math.round(v * 100)}%`);

describe('outcome dashboards in the browser', () => {
  it('loads the sign-in screen without the Vega libraries', () => {
    expect(scripts.length).toBeGreaterThan(0);
    expect(scripts.filter((s) => /vega/i.test(s))).toEqual([]);
  });

  it('clinic results: tiles and three charts match the API, with no console error under the CSP', async () => {
    onTestFailed(() => b.saveArtifacts('clinic-results'));
    const data: OutcomesResponse = await open(b.page, '/results', '/api/analytics/outcomes', (x) =>
      OutcomesResponseSchema.parse(x),
    );
    expect(data.tiles.episodes).toBeGreaterThan(100);
    await expect
      .poll(() => b.page.getByTestId('tile-episodes').textContent())
      .toContain(data.tiles.episodes.toLocaleString('en'));
    expect(await b.page.getByTestId('tile-recovered').textContent()).toContain(
      pct(data.tiles.recovered.share?.estimate),
    );
    expect(await b.page.getByTestId('tile-responders').textContent()).toContain(
      pct(data.tiles.responders?.share?.estimate),
    );
    expect(await b.page.getByTestId('tile-completeness').textContent()).toContain(
      pct(data.tiles.completeness.share?.estimate),
    );
    await expectMarks(b.page, 'chart-recovery', ['line', 'area']);
    await expectMarks(b.page, 'chart-changes', ['rect']);
    await expectMarks(b.page, 'chart-trend', ['line']);
    expect(scripts.some((s) => /vega/i.test(s))).toBe(true); // the charts chunk arrived on demand
    const curveRows = await tableRows(b.page, 'chart-recovery');
    const readings = data.curves.flatMap((c) =>
      c.readings.map((r) => [c.label, String(r.weeks), pct(r.share), pct(r.lower), pct(r.upper)]),
    );
    expect(readings.length).toBeGreaterThan(10);
    expect(curveRows).toEqual(readings);
    const changeRows = await tableRows(b.page, 'chart-changes');
    expect(changeRows.map((r) => [r[0], r[1]])).toEqual(
      data.changes.map((c) => [c.instrument.label, c.n.toLocaleString('en')]),
    );
    const trendRows = await tableRows(b.page, 'chart-trend');
    expect(trendRows.map((r) => r[0])).toEqual(data.trend.map((q) => q.quarter));
    expect(b.problems()).toEqual([]);
  });

  it('recovery curves: a filter change refetches, keeps the old view, and the table agrees with the API', async () => {
    onTestFailed(() => b.saveArtifacts('recovery-curves'));
    const data = await open(b.page, '/recovery?groupBy=activity', '/api/analytics/recovery', (x) =>
      RecoveryResponseSchema.parse(x),
    );
    await expectMarks(b.page, 'chart-recovery-groups', ['line']);
    const table = b.page.getByTestId('recovery-table');
    for (const g of data.groups) {
      const row = table.locator(`tr[data-level="${g.level}"]`);
      expect(await row.locator('td').first().textContent()).toBe(g.n === null ? '–' : g.n.toLocaleString('en'));
    }
    expect(await b.page.getByTestId('log-rank').textContent()).toMatch(data.logRank ? /Log-rank/ : /No log-rank/);
    const next = b.page.waitForResponse(
      (r) => r.url().includes('/api/analytics/recovery') && r.url().includes('groupBy=bmi'),
    );
    await b.page.getByLabel('Compare by').selectOption('bmi');
    const bmi = RecoveryResponseSchema.parse(await (await next).json());
    expect(new URL(b.page.url()).searchParams.get('groupBy')).toBe('bmi');
    await expect.poll(() => table.locator('tr[data-level]').count()).toBe(bmi.groups.length + 1);
    expect(b.problems()).toEqual([]);
  });

  it('exercise signals: the forest plot and its table, with the standing caution', async () => {
    onTestFailed(() => b.saveArtifacts('exercise-signals'));
    const data = await open(b.page, '/exercise-signals?clinic=registry', '/api/analytics/addons', (x) =>
      AddOnsResponseSchema.parse(x),
    );
    await expectMarks(b.page, 'chart-forest', ['symbol', 'rule']);
    await expect.poll(() => b.page.getByText('Associations, not effects').count()).toBe(1);
    const rows = await tableRows(b.page, 'chart-forest');
    expect(rows.map((r) => r[0])).toEqual(data.rows.map((r) => r.label));
    const taping = data.rows.find((r) => r.adjusted)!;
    const row = rows.find((r) => r[0] === taping.label)!;
    expect(row[4]).toContain(taping.adjusted!.riskRatio.toFixed(2));
    expect(b.problems()).toEqual([]);
  });

  it('peer comparison: funnel with the own clinic named and peers anonymous', async () => {
    onTestFailed(() => b.saveArtifacts('peer-comparison'));
    const data = await open(b.page, '/peers', '/api/analytics/clinics', (x) => ClinicsResponseSchema.parse(x));
    await expectMarks(b.page, 'chart-funnel', ['line', 'symbol']);
    const rows = await tableRows(b.page, 'chart-funnel');
    expect(rows.map((r) => r[0])).toEqual(data.clinics.map((c) => c.label));
    expect(rows.filter((r) => r[0]!.startsWith('Your clinic'))).toHaveLength(1);
    expect(await b.page.content()).not.toContain('Willowbank');
    expect(b.problems()).toEqual([]);
  });

  it('episode screen: the course-of-care chart for a clinician, with steps and its table', async () => {
    const c = await newPage(app);
    try {
      await signIn(c.page, 'clinician@demo.loadline.test');
      c.clearProblems();
      // The clinician's clinic's episode with the most assessments.
      const { rows } = await app.db.execute<{ id: number }>(sql`
        select e.id from episode e join clinic c on c.id = e.clinic_id join assessment a on a.episode_id = e.id
        where c.code = 'C01' group by e.id order by count(*) desc, e.id limit 1`);
      const id = rows[0]!.id;
      const data = await open(c.page, `/episodes/${id}`, `/api/analytics/episodes/${id}/trajectory`, (x) =>
        TrajectoryResponseSchema.parse(x),
      );
      await expectMarks(c.page, 'chart-trajectory', ['line', 'rect']);
      const pain = data.instruments.find((i) => i.instrument.code === 'nprs-first-step')!;
      const rowsShown = await tableRows(c.page, 'chart-trajectory');
      expect(rowsShown.map((r) => [r[0], r[3]])).toEqual(pain.points.map((p) => [p.assessedOn, String(p.value)]));
      expect(rowsShown.filter((r) => r[5] !== '').length).toBe(data.flags.length);
      expect(c.problems()).toEqual([]);
    } catch (e) {
      await c.saveArtifacts('episode-trajectory');
      throw e;
    } finally {
      await c.close();
    }
  });

  it('works at tablet width: the dashboards need no sideways scrolling', async () => {
    const t = await newPage(app, { viewport: { width: 820, height: 1100 } });
    try {
      await signIn(t.page, 'lead@demo.loadline.test');
      t.clearProblems();
      for (const [path, chart] of [
        ['/results', 'chart-changes'],
        ['/recovery', 'chart-recovery-groups'],
        ['/exercise-signals?clinic=registry', 'chart-forest'],
        ['/peers', 'chart-funnel'],
      ] as const) {
        await t.page.goto(path);
        await t.page.getByTestId(chart).locator('svg').first().waitFor({ timeout: 60_000 });
        // The screen's own content (the shell's header is not part of these screens).
        const overflow = await t.page.evaluate(() => {
          const main = document.querySelector('main')!;
          return main.scrollWidth - main.clientWidth;
        });
        expect(overflow, path).toBeLessThanOrEqual(0);
      }
      expect(t.problems()).toEqual([]);
    } catch (e) {
      await t.saveArtifacts('tablet');
      throw e;
    } finally {
      await t.close();
    }
  });
});
