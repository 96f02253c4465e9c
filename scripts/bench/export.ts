/**
 * Benchmark of the de-identified research export.
 *
 * Run with `npm run bench:export` (options: `--episodes N` (default 100000), `--own-seed` to skip the demo
 * generator, `--keep` to keep the benchmark database, `--reuse NAME` to run again on a kept one, `--profile` to write
 * the server's CPU profile to /tmp/loadline-bench-export-profile). It creates its own database, loads N invented episodes
 * with the demo seed generator (or, if that is unavailable, with a fast SQL insert of its own), saves a cohort of
 * every consenting episode, has it approved with every variable group, then starts a real server in a child
 * process and downloads the CSV over HTTP. It prints rows/s and the server's peak resident memory (VmHWM from
 * /proc), then starts a second download, abandons it after 1 MB and checks that the export log says "aborted".
 * Targets: >= 50,000 rows/s and peak RSS < 200 MB. It ends with one `bench: target met: yes|no (…)` line and exits
 * 0 either way, so `npm run bench` always goes on to the next benchmark; only a benchmark that cannot run exits 1.
 * The machine may be shared: compare figures with the load average and CPU times printed beside them.
 */
import { fork, type ChildProcess } from 'node:child_process';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { availableParallelism, loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import { desc, eq, sql } from 'drizzle-orm';
import { openDatabase, type Db } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { dataRequests, exportLog, users } from '../../server/db/schema';
import { hashPassword } from '../../server/auth/passwords';
import { scopeOf } from '../../server/db/scope';
import { createCohort } from '../../server/services/cohorts/cohorts.service';
import { approveDataRequest, createDataRequest } from '../../server/services/exports/data-requests.service';
import { REQUESTABLE_GROUPS } from '../../shared/export-columns';
import { CohortCriteriaSchema } from '../../shared/schemas/cohort';
import { createDatabase, dropDatabase, ensurePostgres } from '../db';
import { ownSeed } from './export-seed';
import { cpuByPid, cpuOf, cpuSince, memoryOf } from './proc-cpu';

const PASSWORD = 'bench-export-password';
const argv = process.argv.slice(2);
const flag = (name: string) => argv.includes(name);
const opt = (name: string) => (argv.includes(name) ? argv[argv.indexOf(name) + 1] : undefined);

/** Child mode: serve the API of the benchmark database on a free loopback port. */
async function serve(url: string): Promise<void> {
  const { createApp } = await import('../../server/app');
  const database = openDatabase(url, 4);
  const app = createApp({ ...database, log: (m) => console.error(m), mailer: { send: async () => undefined } });
  const server = app.listen(0, '127.0.0.1', () => process.send?.({ port: (server.address() as AddressInfo).port }));
  // A clean exit on request, so `--profile` can write the CPU profile.
  process.on('message', (m) => m === 'exit' && process.exit(0));
}

/** The PostgreSQL backends serving the benchmark database (to count their CPU too). */
async function backendPids(db: Db): Promise<number[]> {
  const { rows } = await db.execute<{ pid: number }>(
    sql`select pid from pg_stat_activity where datname = current_database() and pid <> pg_backend_pid()`,
  );
  return rows.map((r) => Number(r.pid));
}

async function seed(db: Db, episodes: number): Promise<string> {
  if (!flag('--own-seed')) {
    try {
      const { loadDemoIfEmpty } = await import('../seed');
      const loaded = await loadDemoIfEmpty(db, { episodes });
      if (loaded && loaded.episodes === episodes) return 'demo seed generator';
      console.log('bench: the demo generator did not load the asked size; using the own SQL insert');
    } catch (e) {
      console.log(`bench: demo seed generator unavailable (${e instanceof Error ? e.message : String(e)}); using the own SQL insert`);
    }
  }
  await ownSeed(db, episodes);
  return 'own SQL insert';
}

async function prepare(db: Db): Promise<{ requestId: number; email: string }> {
  const hash = await hashPassword(PASSWORD);
  const [researcher] = await db.insert(users).values({ email: 'bench-researcher@bench.loadline.test', name: 'Bench researcher', role: 'researcher', passwordHash: hash }).returning();
  const [steward] = await db.insert(users).values({ email: 'bench-steward@bench.loadline.test', name: 'Bench steward', role: 'steward', passwordHash: hash }).returning();
  const rs = scopeOf({ ...researcher!, clinicId: null });
  const cohort = await createCohort(db, rs, { name: 'Everyone consenting', description: 'Benchmark cohort', criteria: CohortCriteriaSchema.parse({ conditionCode: 'plantar-heel-pain' }) });
  const request = await createDataRequest(db, rs, { cohortId: cohort.id, purpose: 'Benchmark of the export stream', variableGroups: [...REQUESTABLE_GROUPS] });
  await approveDataRequest(db, scopeOf({ ...steward!, clinicId: null }), request.id, { expiresOn: '2099-12-31', startGranularity: 'year', allowRawBmi: false }, { mailer: { send: async () => undefined }, log: console.error });
  return { requestId: request.id, email: researcher!.email };
}

/** Signs in over HTTP like a browser: CSRF token, then the login form, keeping the cookies. */
async function signIn(base: string, email: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (r: Response) => r.headers.getSetCookie().forEach((c) => jar.set(c.split('=')[0]!, c.split(';')[0]!));
  const cookie = () => [...jar.values()].join('; ');
  const csrf = await fetch(`${base}/api/auth/csrf`);
  keep(csrf);
  const { token } = (await csrf.json()) as { token: string };
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie: cookie() },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (!login.ok) throw new Error(`sign-in failed: ${login.status}`);
  keep(login);
  return cookie();
}

/**
 * Downloads over HTTP like a browser would, counting bytes and lines. With node:http's plain 'data' events: this
 * client shares the two cores with the server and PostgreSQL it measures, and fetch's web-stream reader used
 * about twice its CPU (0.22-0.24 s a download).
 */
function download(url: string, cookie: string, abortAfterBytes?: number) {
  const started = performance.now();
  return new Promise<{ seconds: number; bytes: number; rows: number; headers: http.IncomingHttpHeaders }>((resolve, reject) => {
    const req = http.get(url, { headers: { cookie } }, (res) => {
      if (res.statusCode !== 200) {
        res.resume();
        reject(new Error(`download failed: ${res.statusCode}`));
        return;
      }
      let bytes = 0;
      let lines = 0;
      const done = () => resolve({ seconds: (performance.now() - started) / 1000, bytes, rows: lines - 1, headers: res.headers });
      res.on('data', (chunk: Buffer) => {
        bytes += chunk.length;
        // indexOf rather than a loop over every byte, for the same reason.
        for (let i = chunk.indexOf(10); i !== -1; i = chunk.indexOf(10, i + 1)) lines++;
        if (abortAfterBytes !== undefined && bytes >= abortAfterBytes) {
          req.destroy();
          done();
        }
      });
      res.on('end', done);
      res.on('error', (e) => (abortAfterBytes === undefined ? reject(e) : done()));
    });
    req.on('error', (e) => (abortAfterBytes === undefined ? reject(e) : undefined));
  });
}

async function main(): Promise<void> {
  const episodes = Number(opt('--episodes') ?? 100_000);
  const cluster = await ensurePostgres();
  const reuse = opt('--reuse');
  const name = reuse ?? `loadline_bench_export_${process.pid}`;
  const url = reuse ? cluster.urlFor(reuse) : await createDatabase(cluster, name, false);
  const database = openDatabase(url, 4);
  let child: ChildProcess | undefined;
  try {
    let requestId: number;
    let email: string;
    if (reuse) {
      const [r] = await database.db.select().from(dataRequests).orderBy(dataRequests.id).limit(1);
      const [u] = await database.db.select().from(users).where(eq(users.id, r!.requesterId));
      [requestId, email] = [r!.id, u!.email];
    } else {
      await migrateDatabase(database.db);
      const t = performance.now();
      const how = await seed(database.db, episodes);
      console.log(`bench: ${episodes} episodes loaded with the ${how} in ${((performance.now() - t) / 1000).toFixed(1)} s`);
      ({ requestId, email } = await prepare(database.db));
      await database.db.execute('vacuum analyze');
    }

    const profile = flag('--profile') ? ['--cpu-prof', '--cpu-prof-dir=/tmp/loadline-bench-export-profile'] : [];
    const server = fork(fileURLToPath(import.meta.url), ['--serve', url], {
      execArgv: ['--import', 'tsx', ...profile],
      stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
    });
    child = server;
    const port = await new Promise<number>((resolve, reject) => {
      server.once('message', (m) => resolve((m as { port: number }).port));
      server.once('exit', (code) => reject(new Error(`server exited with ${code}`)));
    });
    const base = `http://127.0.0.1:${port}`;
    const cookie = await signIn(base, email);
    const before = memoryOf(server.pid!);
    const pgBefore = cpuByPid(await backendPids(database.db));
    const serverCpuBefore = cpuOf(server.pid!);
    let sampledPeak = before.rssMb;
    const sampler = setInterval(() => (sampledPeak = Math.max(sampledPeak, memoryOf(server.pid!).rssMb)), 25);
    const clientCpu = process.cpuUsage();
    const d = await download(`${base}/api/data-requests/${requestId}/export.csv`, cookie);
    const clientUsed = process.cpuUsage(clientCpu);
    clearInterval(sampler);
    const after = memoryOf(server.pid!);
    const cpu = { server: cpuOf(server.pid!) - serverCpuBefore, pg: cpuSince(pgBefore, cpuByPid(await backendPids(database.db))) };
    const rowsPerSecond = d.rows / d.seconds;
    console.log(`bench: ${d.rows} rows (${(d.bytes / 1e6).toFixed(1)} MB; ${d.headers['x-export-generalised-rows']} generalised, ${d.headers['x-export-suppressed-rows']} suppressed) in ${d.seconds.toFixed(2)} s`);
    console.log(`bench: ${Math.round(rowsPerSecond).toLocaleString('en')} rows/s, ${(d.bytes / 1e6 / d.seconds).toFixed(1)} MB/s (target >= 50,000 rows/s)`);
    console.log(
      `bench: CPU used: server ${cpu.server.toFixed(2)} s, PostgreSQL ${cpu.pg.toFixed(2)} s, this client ${((clientUsed.user + clientUsed.system) / 1e6).toFixed(2)} s; load average ${loadavg()[0]!.toFixed(1)} on ${availableParallelism()} CPUs (rows per CPU-second of the busier side: ${Math.round(d.rows / Math.max(cpu.server, cpu.pg, 0.01)).toLocaleString('en')})`,
    );
    console.log(`bench: server RSS ${before.rssMb.toFixed(0)} MB before, peak ${after.peakMb.toFixed(0)} MB (VmHWM; sampled ${sampledPeak.toFixed(0)} MB) (target < 200 MB)`);

    await download(`${base}/api/data-requests/${requestId}/export.csv`, cookie, 1_000_000);
    await new Promise((r) => setTimeout(r, 1000));
    const [last] = await database.db.select().from(exportLog).where(eq(exportLog.requestId, requestId)).orderBy(desc(exportLog.id)).limit(1);
    console.log(`bench: abandoned download logged as "${last?.status}" after ${last?.rowCount} rows`);
    const checks = [
      `${Math.round(rowsPerSecond).toLocaleString('en')} rows/s >= 50,000: ${rowsPerSecond >= 50_000 ? 'yes' : 'no'}`,
      `peak RSS ${after.peakMb.toFixed(0)} MB < 200 MB: ${after.peakMb < 200 ? 'yes' : 'no'}`,
      `abandoned download audited as aborted: ${last?.status === 'aborted' ? 'yes' : 'no'}`,
    ];
    const met = checks.every((c) => c.endsWith(': yes'));
    console.log(
      `bench: target met: ${met ? 'yes' : 'no'} (${checks.join('; ')}; load average ${loadavg()[0]!.toFixed(1)})`,
    );
  } finally {
    if (child?.connected) {
      const exited = new Promise((r) => child!.once('exit', r));
      child.send('exit');
      await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
    }
    child?.kill();
    await database.pool.end();
    if (!flag('--keep') && !reuse) await dropDatabase(cluster, name);
  }
}

if (flag('--serve')) {
  serve(argv[argv.indexOf('--serve') + 1]!).catch((e: unknown) => {
    console.error(e);
    process.exit(1);
  });
} else {
  main().catch((e: unknown) => {
    console.error(`bench: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
    process.exit(1);
  });
}
