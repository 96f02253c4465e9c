/**
 * Benchmark of the CSV upload: 100,000 assessment rows (the demo generator's invented episodes), checked
 * (dry run), committed, and sent again (nothing to change), on a benchmark database of its own that is
 * dropped at the end. Calls the upload service as the route does, after multer has the file in memory.
 *
 *   npm run bench:upload [-- --rows 100000]
 *
 * Targets: at least 20,000 rows/s committed, peak resident memory under 300 MB. Besides wall time it prints the
 * CPU time of Node and of every PostgreSQL process during each step (both share the machine's two cores).
 */
import { spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { openDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { clinics, users } from '../../server/db/schema';
import { uploadEpisodes } from '../../server/services/uploads.service';
import { todayUtc } from '../../shared/follow-up-schedule';
import { createDatabase, dropDatabase, ensurePostgres } from '../db';
import { cpuByPid, cpuSince, postgresPids } from './proc-cpu';

/** The upload file, made by a child process (see upload-csv.ts). */
function makeFile(rows: number): Buffer {
  const dir = mkdtempSync(path.join(tmpdir(), 'loadline-bench-'));
  const out = path.join(dir, 'upload.csv.gz');
  const script = path.join(path.dirname(fileURLToPath(import.meta.url)), 'upload-csv.ts');
  const flags = process.execArgv.filter((a) => !a.startsWith('--max-old-space-size'));
  const r = spawnSync(process.execPath, [...flags, script, String(rows), '7', todayUtc(), out], { stdio: 'inherit' });
  if (r.status !== 0) throw new Error('could not generate the upload file');
  const file = readFileSync(out);
  rmSync(dir, { recursive: true, force: true });
  return file;
}

const argRows = process.argv.indexOf('--rows');
const ROWS = argRows === -1 ? 100_000 : Number(process.argv[argRows + 1]);

let peakRss = 0;
let commitRate = 0;
let phasePeak = 0;
const sampler = setInterval(() => {
  const rss = process.memoryUsage.rss(); // the RSS alone: memoryUsage() also gathers heap statistics, costly every 20 ms
  peakRss = Math.max(peakRss, rss);
  phasePeak = Math.max(phasePeak, rss);
}, 20);
const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(0)} MB`;

async function main(): Promise<void> {
  const cluster = await ensurePostgres();
  const name = `loadline_bench_upload_${randomBytes(3).toString('hex')}`;
  const database = openDatabase(await createDatabase(cluster, name, false), 4);
  try {
    await migrateDatabase(database.db);
    const [clinic] = await database.db.insert(clinics).values({ code: 'BENCH', displayName: 'Bench clinic', region: 'Bench' }).returning();
    const [user] = await database.db.insert(users).values({ email: 'bench@bench.loadline.test', role: 'lead', clinicId: clinic!.id }).returning();
    const scope = { kind: 'clinic' as const, clinicId: clinic!.id, userId: user!.id };

    const packed = makeFile(ROWS);
    const plainBytes = packed.readUInt32LE(packed.length - 4); // gzip's trailer states the unpacked size
    console.log(`file: ${ROWS.toLocaleString('en')} rows, ${mb(plainBytes)} as CSV, ${mb(packed.length)} gzip-compressed (uploaded: the limit is 10 MiB)`);
    const file = { buffer: packed, originalname: 'bench.csv.gz' };
    for (const [label, dryRun] of [['dry run', true], ['commit', false], ['re-upload (no change)', false]] as const) {
      phasePeak = 0;
      const cpu = process.cpuUsage();
      const pgBefore = cpuByPid(postgresPids());
      const started = performance.now();
      const answer = await uploadEpisodes(database.db, scope, file, dryRun);
      const seconds = (performance.now() - started) / 1000;
      const used = process.cpuUsage(cpu);
      const nodeCpu = (used.user + used.system) / 1e6;
      const pgCpu = cpuSince(pgBefore, cpuByPid(postgresPids()));
      if (answer.status !== 200) throw new Error(`${label}: ${answer.status} ${JSON.stringify(answer.body.errors.slice(0, 3))}`);
      const c = answer.body.changes!;
      if (label === 'commit') commitRate = ROWS / seconds;
      console.log(
        `${label.padEnd(22)} ${seconds.toFixed(2)} s  ${Math.round(ROWS / seconds).toLocaleString('en').padStart(7)} rows/s  ` +
          `(episodes +${c.episodesCreated} ~${c.episodesUpdated}, assessments +${c.assessmentsCreated} ~${c.assessmentsUpdated}, unchanged rows ${c.rowsUnchanged}), Node CPU ${nodeCpu.toFixed(1)} s, PostgreSQL CPU ${pgCpu.toFixed(1)} s, peak RSS ${mb(phasePeak)}`,
      );
    }
  } finally {
    await database.pool.end();
    await dropDatabase(cluster, name);
    clearInterval(sampler);
  }
  const maxRss = process.resourceUsage().maxRSS * 1024;
  console.log(`peak RSS: ${mb(Math.max(peakRss, maxRss))} (resourceUsage maxRSS ${mb(maxRss)}, sampled ${mb(peakRss)})`);
  console.log(`targets: ≥ 20,000 rows/s committed; peak RSS < 300 MB. Machine load when measured: ${(await import('node:os')).loadavg()[0]!.toFixed(1)} (1-min average)`);
  const met = commitRate >= 20_000 && Math.max(peakRss, maxRss) < 300 * 1024 * 1024;
  console.log(`bench: target met: ${met ? 'yes' : 'no'} (commit ${Math.round(commitRate).toLocaleString('en')} rows/s, peak RSS ${mb(Math.max(peakRss, maxRss))})`);
}

main().catch((e: unknown) => {
  console.error(`bench:upload: ${e instanceof Error ? e.message : String(e)}`);
  process.exit(1);
});
