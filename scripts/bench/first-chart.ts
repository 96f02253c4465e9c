/**
 * Client figures: the entry bundle's gzip size (from a production build's manifest: the entry chunk, the chunks it
 * imports statically, and their CSS) and the Clinic results screen's time to its first drawn chart mark in headless
 * Chromium, signed in as the demo lead, on a benchmark database of its own with the demo loaded (dropped at the end).
 *
 *   npm run bench -- (all benchmarks) · tsx scripts/bench/first-chart.ts [--runs 5]
 *
 * Prints one JSON line per figure on stdout; progress goes to stderr.
 */
import { randomBytes } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import express from 'express';
import { chromium } from 'playwright-core';
import { build } from 'vite';
import { createApp } from '../../server/app';
import { openDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { checkoutRoot, createDatabase, dropDatabase, ensurePostgres } from '../db';
import { DEMO_PASSWORD, loadDemoIfEmpty } from '../seed';

export type Figure = { figure: string; value: number; unit: string; target?: number; ratio?: number; note?: string };

/** Our own budget for what loads before any chart (the analytics benchmark checks the same figure). */
const ENTRY_TARGET_BYTES = 200 * 1024;
/** Web Vitals' "good" largest contentful paint is 2.5 s (web.dev; from memory); the first chart should meet it. */
const FIRST_CHART_TARGET_MS = 2500;
/** The same flags as the browser tests (tests/e2e/harness.ts): Debian's Chromium, no downloads. */
const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];

const log = (m: string) => process.stderr.write(`first-chart: ${m}\n`);
const withRatio = (f: Figure): Figure => (f.target ? { ...f, ratio: Number((f.value / f.target).toFixed(3)) } : f);

type Manifest = Record<string, { file: string; isEntry?: boolean; imports?: string[]; css?: string[] }>;

/** Gzip bytes of the entry chunk, its static imports (not the lazy ones) and their CSS. */
export function entryBundleBytes(outDir: string): { js: number; css: number; files: number } {
  const manifest = JSON.parse(readFileSync(path.join(outDir, '.vite', 'manifest.json'), 'utf8')) as Manifest;
  const entry = Object.keys(manifest).find((k) => manifest[k]!.isEntry);
  if (!entry) throw new Error('the build manifest names no entry');
  const seen = new Set<string>();
  const visit = (key: string) => {
    if (seen.has(key)) return;
    seen.add(key);
    for (const i of manifest[key]!.imports ?? []) visit(i);
  };
  visit(entry);
  const gz = (file: string) => gzipSync(readFileSync(path.join(outDir, file))).length;
  const chunks = [...seen].map((k) => manifest[k]!);
  const css = new Set(chunks.flatMap((c) => c.css ?? []));
  return { js: chunks.reduce((s, c) => s + gz(c.file), 0), css: [...css].reduce((s, f) => s + gz(f), 0), files: chunks.length + css.size };
}

export async function clientFigures(runs = 5): Promise<Figure[]> {
  const outDir = mkdtempSync(path.join(tmpdir(), 'loadline-bench-client-'));
  const cluster = await ensurePostgres();
  const name = `loadline_bench_chart_${randomBytes(3).toString('hex')}`;
  const database = openDatabase(await createDatabase(cluster, name, false), 8);
  const figures: Figure[] = [];
  try {
    log('building the client (production, with a manifest)…');
    await build({ root: checkoutRoot, mode: 'production', logLevel: 'silent', build: { outDir, emptyOutDir: true, manifest: true } });
    const entry = entryBundleBytes(outDir);
    figures.push(withRatio({ figure: 'entry bundle (gzip, JS + CSS)', value: entry.js + entry.css, unit: 'bytes', target: ENTRY_TARGET_BYTES, note: `${entry.files} files; JS ${entry.js} B, CSS ${entry.css} B` }));

    log('loading the demo into a benchmark database…');
    await migrateDatabase(database.db);
    await loadDemoIfEmpty(database.db);
    const index = path.join(outDir, 'index.html');
    const client = [express.static(outDir, { index: false }), ((req, res, next) => (req.method === 'GET' ? res.sendFile(index) : next())) as express.RequestHandler];
    const app = createApp({ ...database, client, log: () => undefined });
    const server = await new Promise<ReturnType<typeof app.listen>>((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const times: number[] = [];
    try {
      for (let run = 0; run <= runs; run++) {
        // A fresh profile every run: nothing cached, as for someone opening the dashboard for the first time today.
        const profile = mkdtempSync(path.join(tmpdir(), 'loadline-bench-profile-'));
        const context = await chromium.launchPersistentContext(profile, { executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS, viewport: { width: 1280, height: 900 }, baseURL: base });
        try {
          const page = context.pages()[0] ?? (await context.newPage());
          const csrf = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
          const signed = await page.request.post('/api/auth/login', { data: { email: 'lead@demo.loadline.test', password: DEMO_PASSWORD }, headers: { 'x-csrf-token': csrf.token } });
          if (!signed.ok()) throw new Error(`sign-in failed: ${signed.status()}`);
          // Recorded in the page, against its own navigation start: the first mark of any chart in the DOM.
          await page.addInitScript(() => {
            const w = window as unknown as { __firstChart?: number };
            new MutationObserver((_m, obs) => {
              if (document.querySelector('[data-testid^="chart-"] svg g[class*="mark-"] > *')) {
                w.__firstChart = performance.now();
                obs.disconnect();
              }
            }).observe(document, { childList: true, subtree: true });
          });
          await page.goto('/results');
          await page.waitForFunction(() => (window as unknown as { __firstChart?: number }).__firstChart !== undefined, undefined, { timeout: 60_000 });
          const ms = await page.evaluate(() => (window as unknown as { __firstChart: number }).__firstChart);
          if (run > 0) times.push(ms); // run 0 warms the server (its caches and the database's), not the browser
          log(`run ${run}: first chart after ${ms.toFixed(0)} ms${run === 0 ? ' (warm-up, not counted)' : ''}`);
        } finally {
          await context.close();
          rmSync(profile, { recursive: true, force: true });
        }
      }
    } finally {
      await new Promise((r) => server.close(r));
    }
    const sorted = [...times].sort((a, b) => a - b);
    const median = sorted[Math.floor((sorted.length - 1) / 2)]!;
    figures.push(withRatio({ figure: 'Clinic results: time to first chart, median (fresh browser profile)', value: Math.round(median), unit: 'ms', target: FIRST_CHART_TARGET_MS, note: `${runs} runs after a warm-up; slowest ${Math.round(sorted.at(-1)!)} ms` }));
  } finally {
    await database.pool.end();
    await dropDatabase(cluster, name);
    rmSync(outDir, { recursive: true, force: true });
  }
  return figures;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const at = process.argv.indexOf('--runs');
  clientFigures(at === -1 ? 5 : Number(process.argv[at + 1]))
    .then((figures) => {
      for (const f of figures) console.log(JSON.stringify({ benchmark: 'first-chart', ...f }));
      process.exit(0);
    })
    .catch((e: unknown) => {
      console.error(`first-chart: ${e instanceof Error ? e.message : String(e)}`);
      process.exit(1);
    });
}
