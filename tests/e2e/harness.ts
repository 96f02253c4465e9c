/**
 * The browser-test harness: the real app (built client, real API, the run's throw-away PostgreSQL with the
 * demo scenario) on a random loopback port, driven by Debian's Chromium through playwright-core.
 *
 *   const app = await startE2eApp();
 *   const b = await newPage(app);          // fresh browser profile, problems recorded
 *   onTestFailed(() => b.saveArtifacts('my-journey'));
 *   await signIn(b.page, 'lead@demo.loadline.test');
 *   b.allow(422, '/api/uploads/episodes');  // a 4xx the test provokes on purpose; any other 4xx/5xx is a problem
 *   ...; expect(b.problems()).toEqual([]);
 *   await b.close(); await app.close();
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import express, { type RequestHandler } from 'express';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { inject } from 'vitest';
import { createApp, type AppDeps } from '../../server/app';
import { openDatabase, type Database } from '../../server/db/client';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { DEMO_PASSWORD, loadDemoIfEmpty } from '../../scripts/seed';

export const CHROMIUM = '/usr/bin/chromium';
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
];
export const ARTIFACTS = path.resolve(path.dirname(new URL(import.meta.url).pathname), 'artifacts');

/** `mail`: the fake SMTP server the app sends to (unless `deps.mailer` was given); read invitations from it. */
export type E2eApp = Database & { url: string; logs: string[]; mail: FakeSmtp; close(): Promise<void> };

/** The built client from tests/e2e/global-build.ts, with index.html for every client route. */
function builtClient(dir: string): RequestHandler[] {
  const index = path.join(dir, 'index.html');
  return [
    express.static(dir, { index: false }),
    (req, res, next) => (req.method === 'GET' || req.method === 'HEAD' ? res.sendFile(index) : next()),
  ];
}

/** Starts the app on 127.0.0.1 and a free port, with the demo scenario loaded when the database is empty. */
export async function startE2eApp(opts: { demo?: boolean; deps?: Partial<AppDeps> } = {}): Promise<E2eApp> {
  const database = openDatabase(inject('databaseUrl'), 8);
  if (opts.demo !== false) await loadDemoIfEmpty(database.db);
  const logs: string[] = [];
  const mail = await startFakeSmtp({ port: 0 });
  const app = createApp({
    ...database,
    client: builtClient(inject('e2eClientDir')),
    log: (m) => logs.push(m),
    mailer: mail.mailer,
    ...opts.deps,
  });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(0, '127.0.0.1');
    s.once('listening', () => resolve(s));
    s.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  return {
    ...database,
    url: `http://127.0.0.1:${port}`,
    logs,
    mail,
    close: async () => {
      await new Promise((r) => server.close(r));
      await mail.stop();
      await database.pool.end();
    },
  };
}

export type E2ePage = {
  page: Page;
  context: BrowserContext;
  /** Console errors, page errors, failed requests and HTTP errors seen so far. */
  problems(): string[];
  /** Forgets the problems so far (e.g. the expected 401 of /api/auth/me before signing in). */
  clearProblems(): void;
  /**
   * Declares a 4xx answer the test provokes on purpose (e.g. 422 for a file with errors): responses with this
   * status whose path equals `path` (or matches it), and Chromium's console line about them, are no problem.
   * Anything 5xx always is.
   */
  allow(status: number, path: string | RegExp): void;
  /** Screenshot and console log under tests/e2e/artifacts/ (call from onTestFailed). */
  saveArtifacts(name: string): Promise<void>;
  close(): Promise<void>;
};

/** A page in a fresh Chromium profile (its own user-data dir), recording every problem it meets. */
export async function newPage(
  app: E2eApp,
  opts: { viewport?: { width: number; height: number } } = {},
): Promise<E2ePage> {
  const profile = mkdtempSync(path.join(tmpdir(), 'loadline-e2e-profile-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: opts.viewport ?? { width: 1280, height: 900 },
    baseURL: app.url,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const consoleLines: string[] = [];
  const problems: string[] = [];
  const allowed: { status: number; path: string | RegExp }[] = [];
  const isAllowed = (status: number, url: string) => {
    const p = new URL(url, app.url).pathname;
    return (
      status < 500 &&
      allowed.some((a) => a.status === status && (typeof a.path === 'string' ? a.path === p : a.path.test(p)))
    );
  };
  page.on('console', (m) => {
    consoleLines.push(`[${m.type()}] ${m.text()}`);
    // Chromium reports every 4xx/5xx answer as a console error too; an allowed answer's line is expected.
    const status = /^Failed to load resource: the server responded with a status of (\d{3})/.exec(m.text())?.[1];
    if (m.type() === 'error' && !(status && isAllowed(Number(status), m.location().url)))
      problems.push(`console error: ${m.text()}`);
  });
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('requestfailed', (r) => {
    const reason = r.failure()?.errorText ?? '';
    // Leaving a page aborts its requests still in flight: that is the browser's doing, not a failure.
    if (reason !== 'net::ERR_ABORTED') problems.push(`request failed: ${r.method()} ${r.url()} ${reason}`);
  });
  page.on('response', (r) => {
    if (r.status() >= 400 && !isAllowed(r.status(), r.url()))
      problems.push(`HTTP ${r.status()}: ${r.request().method()} ${r.url()}`);
  });
  return {
    page,
    context,
    problems: () => [...problems],
    clearProblems: () => {
      problems.length = 0;
    },
    allow: (status, path) => {
      if (status < 400 || status >= 500) throw new Error(`only 4xx answers can be expected, not ${status}`);
      allowed.push({ status, path });
    },
    saveArtifacts: async (name) => {
      mkdirSync(ARTIFACTS, { recursive: true });
      const safe = name.replace(/[^a-z0-9-]+/gi, '-').toLowerCase();
      await page.screenshot({ path: path.join(ARTIFACTS, `${safe}.png`), fullPage: true }).catch(() => undefined);
      writeFileSync(
        path.join(ARTIFACTS, `${safe}.log`),
        [...consoleLines, '--- problems', ...problems, '--- server', ...app.logs].join('\n'),
      );
    },
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Signs in through the real sign-in screen and waits until the app has left it. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 15_000 });
}
