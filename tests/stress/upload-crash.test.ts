import { randomBytes } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Db } from '../../server/db/client';
import { openDatabase, type Database } from '../../server/db/client';
import type { UploadResult } from '../../shared/schemas/upload';
import { consistencyProblems } from '../setup/consistency';
import { createClinic, createUser, TEST_PASSWORD } from '../setup/auth';
import { bulkCsv } from '../server/uploads-fixtures';
import { startChildServer, type ChildServer } from './child-server';
import { HttpClient, type FilePart } from './http-client';

// The app process dies (SIGKILL) in the middle of committing a 50,000-row upload; after a restart the upload is
// entirely stored or not at all, the database is consistent, and the same file can be sent again.
const ROWS = 50_000;
const EPISODES = Math.ceil(ROWS / 3); // bulkCsv: three assessments per episode
const APP_NAME = `loadline-crash-${randomBytes(3).toString('hex')}`;

let database: Database;
let servers: ChildServer[] = [];

beforeAll(() => {
  database = openDatabase(inject('databaseUrl'), 2);
});
afterAll(async () => {
  for (const s of servers) await s.stop();
  await database?.pool.end();
});

const withAppName = (url: string) => `${url}${url.includes('?') ? '&' : '?'}application_name=${APP_NAME}`;

/** The child's connections, and whether one of them is inside a transaction that has written (has an xid). */
async function childBackends(db: Db): Promise<{ n: number; writing: number }> {
  const r = await db.execute<{ n: number; writing: number }>(sql`
    select count(*)::int as n, count(*) filter (where backend_xid is not null)::int as writing
    from pg_stat_activity where application_name = ${APP_NAME}`);
  return r.rows[0]!;
}

async function waitFor(what: string, check: () => Promise<boolean>, timeoutMs: number, everyMs = 10): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

async function stored(db: Db, clinicId: number) {
  const r = await db.execute<{ episodes: number; assessments: number; scores: number; uploads: number; audits: number }>(sql`
    select
      (select count(*)::int from episode where clinic_id = ${clinicId}) as episodes,
      (select count(*)::int from assessment a join episode e on e.id = a.episode_id where e.clinic_id = ${clinicId}) as assessments,
      (select count(*)::int from score s join assessment a on a.id = s.assessment_id join episode e on e.id = a.episode_id
        where e.clinic_id = ${clinicId}) as scores,
      (select count(*)::int from upload where clinic_id = ${clinicId}) as uploads,
      (select count(*)::int from audit_event where clinic_id = ${clinicId} and entity = 'upload') as audits`);
  return r.rows[0]!;
}

describe('crash during an upload commit', () => {
  it('SIGKILL mid-transaction: after a restart the upload is all there or not at all, and it can be sent again', async () => {
    const clinic = await createClinic(database.db, 'Crash clinic');
    const lead = await createUser(database.db, 'lead', clinic.id);
    const file: FilePart = {
      field: 'file',
      name: 'whole-year.csv.gz',
      type: 'application/gzip',
      data: gzipSync(bulkCsv(ROWS, `CRASH${randomBytes(2).toString('hex').toUpperCase().replace(/\d/g, 'X')}E`)),
    };

    const first = await startChildServer(withAppName(inject('databaseUrl')));
    servers.push(first);
    const client = new HttpClient(first.url);
    await client.signIn(lead.email, TEST_PASSWORD);
    const t0 = performance.now();
    const sent = client
      .request('POST', '/api/uploads/episodes?dryRun=0', { file, timeoutMs: 180_000 })
      .then((a) => `answered ${a.status}`, (e: unknown) => `cut off: ${e instanceof Error ? e.message : String(e)}`);
    // Killed only once the commit's transaction has begun writing rows.
    await waitFor('the upload transaction to write', async () => (await childBackends(database.db)).writing > 0, 90_000);
    const killedAt = performance.now() - t0;
    await first.kill();
    servers = servers.filter((s) => s !== first);
    client.close();
    expect(await sent).toMatch(/^cut off/);
    // PostgreSQL notices the dead client and rolls its transaction back; wait until its backends are gone.
    await waitFor('the dead process’s connections to end', async () => (await childBackends(database.db)).n === 0, 60_000, 50);

    const second = await startChildServer(inject('databaseUrl'));
    servers.push(second);
    const after = await stored(database.db, clinic.id);
    const absent = { episodes: 0, assessments: 0, scores: 0, uploads: 0, audits: 0 };
    const present = { episodes: EPISODES, assessments: ROWS, scores: after.scores, uploads: 1, audits: 1 }; // scores: below
    console.log(
      `crash during upload commit: killed ${(killedAt / 1000).toFixed(1)} s after sending; after the restart the upload is ${after.uploads ? 'fully present' : 'fully absent'}`,
      after,
    );
    expect([absent, present]).toContainEqual(after);
    expect(await consistencyProblems(database.db)).toEqual([]);

    // The restarted server takes the same file; sending it again would change nothing, so nothing is doubled.
    const again = new HttpClient(second.url);
    await again.signIn(lead.email, TEST_PASSWORD);
    const answer = await again.request('POST', '/api/uploads/episodes?dryRun=0', { file, timeoutMs: 180_000 });
    again.close();
    expect(answer.status, answer.body.toString().slice(0, 500)).toBe(200);
    console.log(`the same ${ROWS.toLocaleString('en')}-row file sent again after the restart: committed in ${(answer.ms / 1000).toFixed(1)} s`);
    const result = answer.json<UploadResult>();
    expect(result.accepted).toBe(ROWS);
    const final = await stored(database.db, clinic.id);
    expect({ ...final, scores: 0 }).toEqual({ episodes: EPISODES, assessments: ROWS, scores: 0, uploads: after.uploads + 1, audits: after.audits + 1 });
    expect(final.scores).toBeGreaterThanOrEqual(ROWS * 3);
    expect([0, final.scores]).toContain(after.scores); // none of the scores, or exactly all of them
    expect(await consistencyProblems(database.db)).toEqual([]);
  });
});
