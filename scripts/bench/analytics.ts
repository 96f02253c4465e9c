/**
 * Benchmark of the analytics endpoints: `npm run bench:analytics [-- --sizes 2500,100000 --runs 30 --reuse]`.
 *
 * For each size it creates its own database (loadline_bench_analytics_<n>), migrates it, loads the demo
 * scenario with `loadDemoIfEmpty(db, { episodes: n })` from scripts/seed, starts the real app on a random
 * loopback port and signs in as the demo lead. Each endpoint is timed `runs` times over HTTP:
 *   cold  — the data version is bumped before every call, so each answer is recomputed from the database;
 *   warm  — repeated calls answered from the in-process cache;
 *   floor — the endpoint's one SQL query alone (a plain SELECT of the same per-episode tuples).
 * Targets: cold p95 under 300 ms on the demo size (2,500) and under 1.5 s on 100,000 episodes, and the cold
 * median at most 3× the floor. `--only addons,clinics` times only the named endpoints.
 * Last, it builds the client and prints the gzip size of the entry bundle (the charts chunk excluded).
 */
import { gzipSync } from 'node:zlib';
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq, sql } from 'drizzle-orm';
import { build } from 'vite';
import { createApp } from '../../server/app';
import { openDatabase, type Database } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { scopeOf } from '../../server/db/scope';
import { episodes, users } from '../../server/db/schema';
import { buildContext } from '../../server/services/analytics/context';
import { loadEpisodeTuples, type TupleOptions } from '../../server/services/analytics/episode-tuples';
import { outcomesTupleOptions } from '../../server/services/analytics/outcomes.service';
import { recoveryTupleOptions } from '../../server/services/analytics/recovery.service';
import { addOnsTupleOptions } from '../../server/services/analytics/addons.service';
import { clinicsTupleOptions } from '../../server/services/analytics/clinics.service';
import { trajectorySql } from '../../server/services/analytics/trajectory.service';
import { AnalyticsFiltersSchema } from '../../shared/schemas/analytics-filters';
import { checkoutRoot, createDatabase, dropDatabase, ensurePostgres } from '../db';
import { DEMO_PASSWORD, loadDemoIfEmpty } from '../seed';

const args = process.argv.slice(2);
const opt = (name: string, fallback: string) => {
  const i = args.indexOf(name);
  return i === -1 ? fallback : (args[i + 1] ?? fallback);
};
const SIZES = opt('--sizes', '2500,100000').split(',').map(Number);
const RUNS = Number(opt('--runs', '30'));
const REUSE = args.includes('--reuse');
const ONLY = opt('--only', '').split(',').filter(Boolean);
const misses: string[] = [];
const LEAD = 'lead@demo.loadline.test';

const stats = (ms: number[]) => {
  const s = [...ms].sort((a, b) => a - b);
  const at = (q: number) => s[Math.min(s.length - 1, Math.ceil(q * s.length) - 1)] ?? NaN;
  return { median: at(0.5), p95: at(0.95) };
};
const fmt = (v: number) => `${v.toFixed(1).padStart(7)} ms`;

async function signIn(base: string, email: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const [k, v] = (pair ?? '').split('=');
      if (k && v !== undefined) jar.set(k, v);
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const csrf = await fetch(`${base}/api/auth/csrf`);
  keep(csrf);
  const { token } = (await csrf.json()) as { token: string };
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie: cookie() },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status}`);
  keep(res);
  return cookie();
}

async function time(runs: number, f: () => Promise<void>): Promise<number[]> {
  await f(); // warm-up (JIT, connections)
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    await f();
    out.push(performance.now() - t);
  }
  return out;
}

async function prepare(n: number): Promise<{ database: Database; name: string }> {
  const cluster = await ensurePostgres();
  const name = `loadline_bench_analytics_${n}`;
  if (!REUSE) await dropDatabase(cluster, name);
  const url = await createDatabase(cluster, name, true);
  const database = openDatabase(url, 10);
  await migrateDatabase(database.db);
  const started = performance.now();
  const loaded = await loadDemoIfEmpty(database.db, { episodes: n });
  if (loaded) console.log(`seed       ${n} episodes loaded in ${((performance.now() - started) / 1000).toFixed(1)} s`);
  await database.db.execute(sql`analyze`);
  return { database, name };
}

async function benchSize(n: number): Promise<void> {
  console.log(`\n== ${n.toLocaleString('en')} episodes`);
  const { database } = await prepare(n);
  const db = database.db;
  const app = createApp({ ...database, log: (m) => console.error(m) });
  const server = await new Promise<Server>((r) => {
    const s = app.listen(0, '127.0.0.1', () => r(s));
  });
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  try {
    const cookie = await signIn(base, LEAD);
    const [lead] = await db.select().from(users).where(eq(users.email, LEAD));
    const scope = scopeOf({
      id: lead!.id,
      email: lead!.email,
      name: lead!.name,
      role: lead!.role,
      clinicId: lead!.clinicId,
    });
    const [ep] = await db
      .select({ id: episodes.id })
      .from(episodes)
      .where(eq(episodes.clinicId, lead!.clinicId!))
      .limit(1);
    const cases: {
      name: string;
      url: string;
      floor: (ctx: Awaited<ReturnType<typeof buildContext>>) => TupleOptions | null;
    }[] = [
      { name: 'outcomes', url: '/api/analytics/outcomes', floor: outcomesTupleOptions },
      { name: 'recovery', url: '/api/analytics/recovery?groupBy=bmi&clinic=registry', floor: recoveryTupleOptions },
      { name: 'addons', url: '/api/analytics/addons?clinic=registry', floor: addOnsTupleOptions },
      { name: 'clinics', url: '/api/analytics/clinics', floor: clinicsTupleOptions },
      { name: 'trajectory', url: `/api/analytics/episodes/${ep!.id}/trajectory`, floor: () => null },
    ];
    const bump = () => db.execute(sql`insert into registry_data_change default values`);
    for (const c of cases.filter((x) => ONLY.length === 0 || ONLY.includes(x.name))) {
      const call = async () => {
        const res = await fetch(`${base}${c.url}`, { headers: { cookie } });
        if (res.status !== 200) throw new Error(`${c.url}: ${res.status} ${await res.text()}`);
        await res.arrayBuffer();
      };
      const cold = stats(await time(RUNS, async () => (await bump(), await call())));
      const warm = stats(await time(RUNS, call));
      const query = new URL(c.url, base).searchParams;
      const filters = AnalyticsFiltersSchema.parse(Object.fromEntries(query));
      const ctx = await buildContext(db, scope, 'lead', filters);
      const options = c.floor(ctx);
      const floor = stats(
        await time(RUNS, async () => {
          if (options) await loadEpisodeTuples(db, options);
          else await db.execute(trajectorySql(scope, ep!.id));
        }),
      );
      const target = n <= 2500 ? 300 : 1500;
      const verdict = cold.p95 < target ? `ok (p95 < ${target} ms)` : `OVER ${target} ms at p95`;
      const ratio = cold.median / floor.median;
      if (!(cold.p95 < target)) misses.push(`${c.name} p95 at ${n}`);
      if (options && ratio > 3) misses.push(`${c.name} ratio at ${n}`);
      console.log(`${c.name.padEnd(10)} cold  median ${fmt(cold.median)}  p95 ${fmt(cold.p95)}  ${verdict}`);
      console.log(`${c.name.padEnd(10)} warm  median ${fmt(warm.median)}  p95 ${fmt(warm.p95)}`);
      console.log(`${c.name.padEnd(10)} floor median ${fmt(floor.median)}  p95 ${fmt(floor.p95)}  (SQL tuples only)`);
      if (options)
        console.log(
          `${c.name.padEnd(10)} cold median / floor median ratio=${ratio.toFixed(2)} ${ratio <= 3 ? 'ok (<= 3)' : 'OVER 3 times the floor'}`,
        );
    }
  } finally {
    await new Promise((r) => server.close(r));
    await database.pool.end();
  }
}

/** Gzip size of what the browser loads before any chart: the entry script, its preloaded chunks and CSS. */
async function entryBundle(): Promise<void> {
  const outDir = mkdtempSync(path.join(tmpdir(), 'loadline-bench-client-'));
  try {
    await build({ root: checkoutRoot, logLevel: 'silent', build: { outDir, emptyOutDir: true } });
    const html = readFileSync(path.join(outDir, 'index.html'), 'utf8');
    const refs = [...html.matchAll(/(?:src|href)="\/(assets\/[^"]+\.(?:js|css))"/g)].map((m) => m[1]!);
    const gz = (f: string) => gzipSync(readFileSync(path.join(outDir, f))).length;
    const js = refs.filter((f) => f.endsWith('.js'));
    const css = refs.filter((f) => f.endsWith('.css'));
    const kb = (b: number) => `${(b / 1024).toFixed(1)} KB`;
    const jsGz = js.reduce((s, f) => s + gz(f), 0);
    const cssGz = css.reduce((s, f) => s + gz(f), 0);
    const charts = readdirSync(path.join(outDir, 'assets')).filter(
      (f) => f.startsWith('vega-chart') && f.endsWith('.js'),
    );
    const vegaInEntry = js.some((f) => f.includes('vega'));
    console.log(
      `\nentry bundle gzip: ${kb(jsGz)} JS + ${kb(cssGz)} CSS = ${kb(jsGz + cssGz)} (${js.length} JS files) ${jsGz + cssGz < 200 * 1024 ? 'ok (< 200 KB)' : 'OVER 200 KB'}`,
    );
    for (const f of charts)
      console.log(
        `charts chunk ${f}: ${kb(gz(`assets/${f}`))} gzip (${kb(statSync(path.join(outDir, 'assets', f)).size)} raw), lazy`,
      );
    console.log(`vega in the entry bundle: ${vegaInEntry ? 'YES (wrong)' : 'no'}`);
  } finally {
    rmSync(outDir, { recursive: true, force: true });
  }
}

async function main(): Promise<void> {
  for (const n of SIZES) await benchSize(n);
  console.log(`bench: target met: ${misses.length === 0 ? 'yes' : 'no'}${misses.length ? ` (missed: ${misses.join(', ')})` : ''}`);
  await entryBundle();
}

main().then(
  () => process.exit(0),
  (e: unknown) => {
    console.error(`bench:analytics failed: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
    process.exit(1);
  },
);
