import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, desc, eq, sql } from 'drizzle-orm';
import { gzipSync } from 'node:zlib';
import { auditEvents } from '../../server/db/schema';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { createClinic, snapshot } from './episodes-fixtures';
import { bulkCsv } from './uploads-fixtures';

const ctx = testApp();
let clinicId: number;
let lead: Client;
afterAll(() => ctx.close());
beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'BULK')).id;
  lead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', clinicId)).email);
});

const ROWS = 100_000;
const EPISODES = Math.ceil(ROWS / 3);
// Each episode: a baseline with 3 scores, then week 6 and week 12 with 4 (GROC added).
const SCORES = Math.ceil(ROWS / 3) * 3 + (ROWS - Math.ceil(ROWS / 3)) * 4;

const send = (text: string) =>
  lead.post('/api/uploads/episodes?dryRun=0').attach('file', gzipSync(text), 'large.csv.gz');

async function clinicCounts() {
  const r = await ctx.db.execute<{ e: number; a: number; s: number; i: number }>(sql`
    select (select count(*) from episode where clinic_id = ${clinicId})::int as e,
      (select count(*) from assessment a join episode e on e.id = a.episode_id where e.clinic_id = ${clinicId})::int as a,
      (select count(*) from score s join assessment a on a.id = s.assessment_id join episode e on e.id = a.episode_id where e.clinic_id = ${clinicId})::int as s,
      (select count(*) from episode_intervention x join episode e on e.id = x.episode_id where e.clinic_id = ${clinicId})::int as i`);
  return r.rows[0]!;
}

describe('CSV upload of 100,000 rows', () => {
  it('commits in one go, a re-upload is a no-op, and a corrected file updates in place with an audit entry', async () => {
    const file = bulkCsv(ROWS, 'BK-');
    expect(Buffer.byteLength(file)).toBeGreaterThan(10 * 1024 * 1024); // why the test sends it gzip-compressed

    const first = await send(file);
    expect(first.status, JSON.stringify(first.body).slice(0, 500)).toBe(200);
    expect(first.body).toMatchObject({ accepted: ROWS, rejected: 0, changes: { episodesCreated: EPISODES, assessmentsCreated: ROWS } });
    expect(await clinicCounts()).toEqual({ e: EPISODES, a: ROWS, s: SCORES, i: EPISODES * 3 });

    const before = await snapshot(ctx.db);
    const again = await send(file);
    expect(again.status).toBe(200);
    expect(again.body.changes).toEqual({ episodesCreated: 0, episodesUpdated: 0, assessmentsCreated: 0, assessmentsUpdated: 0, rowsUnchanged: ROWS });
    const after = await snapshot(ctx.db);
    for (const t of ['episode', 'assessment', 'score', 'episode_intervention']) expect(after[t], t).toBe(before[t]);

    const corrected = bulkCsv(ROWS, 'BK-', (e) => (e % 1000 === 7 ? '79.5' : '82.5'));
    const fix = await send(corrected);
    expect(fix.status).toBe(200);
    expect(fix.body.changes).toMatchObject({ episodesCreated: 0, episodesUpdated: 34, assessmentsCreated: 0, assessmentsUpdated: 0 });
    expect(await clinicCounts()).toEqual({ e: EPISODES, a: ROWS, s: SCORES, i: EPISODES * 3 });
    const changed = await ctx.db.execute<{ n: number }>(sql`select count(*)::int as n from episode where clinic_id = ${clinicId} and weight_kg = 79.5 and version = 2`);
    expect(changed.rows[0]!.n).toBe(34);
    const [audit] = await ctx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.clinicId, clinicId), eq(auditEvents.action, 'upload')))
      .orderBy(desc(auditEvents.id))
      .limit(1);
    expect(audit!.detail).toMatchObject({ rows: ROWS, episodesUpdated: 34, rowsUnchanged: ROWS });
    expect(audit!.detail.changedEpisodes).toHaveLength(34);
    expect(audit!.detail.changedEpisodes).toContainEqual({ reference: 'BK-7', episodeId: expect.any(Number), fields: ['weightKg'], assessments: [] });
  }, 600_000);
});
