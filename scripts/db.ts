/**
 * The one place that installs, initialises, starts and stops the project's own PostgreSQL
 * (Debian's packages) on 127.0.0.1. Idempotent: every step checks before it acts.
 * With DATABASE_URL set, it uses that server instead and starts nothing.
 *
 *   tsx scripts/db.ts start | stop | status
 */
import { createHash } from 'node:crypto';
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, chmodSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { env } from '../server/env';

export class SetupError extends Error {}

export const checkoutRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const isRoot = process.getuid?.() === 0;
const DB_USER = 'app';
export const APP_DATABASE = 'loadline';

export type Cluster = { external: boolean; urlFor(database: string): string };

/** Runs a PostgreSQL tool (as the postgres user when invoked as root); throws with its last line of output. */
export function run(cmd: string, args: string[], asPostgres = isRoot): string {
  const [file, argv] = asPostgres ? ['runuser', ['-u', 'postgres', '--', cmd, ...args]] : [cmd, args];
  const r = spawnSync(file, argv, { encoding: 'utf8' });
  if (r.status !== 0) {
    const detail = (r.stderr || r.stdout || String(r.error ?? '')).trim().split('\n').pop();
    throw new SetupError(`${path.basename(cmd)} failed: ${detail}`);
  }
  return r.stdout;
}

/** The newest installed PostgreSQL's bin directory (Debian's layout), if any. */
export function findBinDir(): string | undefined {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return undefined;
  const versions = readdirSync(base)
    .filter((v) => existsSync(path.join(base, v, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] ? path.join(base, versions[0], 'bin') : undefined;
}

/** Installs Debian's PostgreSQL as root; otherwise says exactly what to run. */
export function installServer(asRoot = isRoot): string {
  if (!asRoot) {
    throw new SetupError(
      'PostgreSQL server is not installed. Install it with: sudo apt-get install -y postgresql (or set DATABASE_URL)',
    );
  }
  console.log('loadline: installing PostgreSQL (apt-get install -y postgresql)…');
  let r = spawnSync('apt-get', ['install', '-y', 'postgresql'], { stdio: 'inherit' });
  if (r.status !== 0) {
    spawnSync('apt-get', ['update'], { stdio: 'inherit' });
    r = spawnSync('apt-get', ['install', '-y', 'postgresql'], { stdio: 'inherit' });
  }
  const bin = findBinDir();
  if (r.status !== 0 || !bin) throw new SetupError('apt-get install -y postgresql failed; see the output above');
  return bin;
}

/** `.data/postgres` in the checkout, or a folder named after the checkout that the postgres user can reach. */
function dataDir(): string {
  const inCheckout = path.join(checkoutRoot, '.data', 'postgres');
  if (!isRoot) return inCheckout;
  mkdirSync(path.dirname(inCheckout), { recursive: true });
  chmodSync(path.dirname(inCheckout), 0o755);
  const reachable = spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', path.dirname(inCheckout)]).status === 0;
  if (reachable) return inCheckout;
  const tag = createHash('sha256').update(checkoutRoot).digest('hex').slice(0, 10);
  return path.join('/var/lib/loadline', `${path.basename(checkoutRoot)}-${tag}`, 'postgres');
}

function portFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once('error', () => resolve(false));
    srv.listen(port, '127.0.0.1', () => srv.close(() => resolve(true)));
  });
}

function runningPort(dir: string): number | undefined {
  const pidFile = path.join(dir, 'postmaster.pid');
  if (!existsSync(pidFile)) return undefined;
  const bin = findBinDir();
  if (!bin) return undefined;
  const [file, argv] = isRoot
    ? ['runuser', ['-u', 'postgres', '--', path.join(bin, 'pg_ctl'), 'status', '-D', dir]]
    : [path.join(bin, 'pg_ctl'), ['status', '-D', dir]];
  if (spawnSync(file, argv).status !== 0) return undefined;
  return Number(readFileSync(pidFile, 'utf8').split('\n')[3]);
}

async function startLocal(): Promise<number> {
  const bin = findBinDir() ?? installServer();
  const dir = dataDir();
  const already = runningPort(dir);
  if (already) return already;

  if (!existsSync(path.join(dir, 'PG_VERSION'))) {
    // Parent folders must stay traversable by the postgres user; only the data folder itself is private.
    mkdirSync(path.dirname(dir), { recursive: true, mode: 0o755 });
    if (!existsSync(dir)) mkdirSync(dir, { mode: 0o700 });
    if (isRoot) execFileSync('chown', ['-R', 'postgres:postgres', path.dirname(dir)]);
    run(path.join(bin, 'initdb'), ['-D', dir, '-A', 'trust', '-U', DB_USER, '-E', 'UTF8', '--locale=C.UTF-8']);
  }
  const port = env().LOADLINE_PG_PORT;
  if (!(await portFree(port))) {
    throw new SetupError(
      `Port ${port} on 127.0.0.1 is already in use by another program; stop it or set LOADLINE_PG_PORT to a free port`,
    );
  }
  const opts = `-c listen_addresses=127.0.0.1 -p ${port} -k ${dir} -c max_connections=200 -c fsync=on`;
  run(path.join(bin, 'pg_ctl'), ['-D', dir, '-o', opts, '-l', path.join(dir, 'server.log'), '-w', '-t', '60', 'start']);
  return port;
}

async function checkReachable(url: string): Promise<void> {
  const client = new pg.Client({ connectionString: url, connectionTimeoutMillis: 5000 });
  try {
    await client.connect();
    await client.query('select 1');
  } catch (e) {
    const u = new URL(url);
    throw new SetupError(`Cannot reach the database at DATABASE_URL (${u.hostname}:${u.port || 5432}${u.pathname}): ${(e as Error).message}`);
  } finally {
    await client.end().catch(() => undefined);
  }
}

/** Ensures a PostgreSQL server is up and returns how to reach its databases. */
export async function ensurePostgres(): Promise<Cluster> {
  const external = env().DATABASE_URL;
  if (external) {
    let parsed: URL;
    try {
      parsed = new URL(external);
    } catch {
      throw new SetupError('DATABASE_URL is not a valid URL (expected postgres://user@host:port/database)');
    }
    await checkReachable(external);
    return {
      external: true,
      urlFor: (database) => Object.assign(new URL(parsed.href), { pathname: `/${database}` }).href,
    };
  }
  const port = await startLocal();
  return { external: false, urlFor: (database) => `postgres://${DB_USER}@127.0.0.1:${port}/${database}` };
}

export async function createDatabase(cluster: Cluster, name: string, ifMissing = true): Promise<string> {
  const admin = new pg.Client({ connectionString: cluster.urlFor('postgres') });
  await admin.connect();
  try {
    const { rowCount } = await admin.query('select 1 from pg_database where datname = $1', [name]);
    if (!rowCount || !ifMissing) await admin.query(`create database "${name}"`);
  } finally {
    await admin.end();
  }
  return cluster.urlFor(name);
}

export async function dropDatabase(cluster: Cluster, name: string): Promise<void> {
  const admin = new pg.Client({ connectionString: cluster.urlFor('postgres') });
  await admin.connect();
  try {
    await admin.query(`drop database if exists "${name}" with (force)`);
  } finally {
    await admin.end();
  }
}

export function stopPostgres(): void {
  const bin = findBinDir();
  const dir = dataDir();
  if (!bin || !runningPort(dir)) return;
  run(path.join(bin, 'pg_ctl'), ['-D', dir, '-m', 'fast', '-w', 'stop']);
}

async function main(cmd: string | undefined): Promise<void> {
  if (cmd === 'start') {
    const cluster = await ensurePostgres();
    console.log(`loadline: PostgreSQL ready at ${await createDatabase(cluster, APP_DATABASE)}`);
  } else if (cmd === 'stop') {
    stopPostgres();
    console.log('loadline: PostgreSQL stopped');
  } else if (cmd === 'status') {
    const port = runningPort(dataDir());
    console.log(port ? `loadline: PostgreSQL running on 127.0.0.1:${port}` : 'loadline: PostgreSQL not running');
  } else {
    throw new SetupError('usage: tsx scripts/db.ts start | stop | status');
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main(process.argv[2]).catch((e: unknown) => {
    console.error(`loadline: ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
