import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { createClinic, snapshot } from './episodes-fixtures';
import { csv, episodeRows } from './uploads-fixtures';

// A commit is checked and written in chunks of episodes, each chunk's statement running while the next one is
// checked. These files span several chunks, so a problem found late meets rows already written in the transaction.
const ctx = testApp();
let clinicId: number;
let lead: Client;
afterAll(() => ctx.close());
beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'UCH')).id;
  lead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', clinicId)).email);
});

const send = (text: string) => lead.post('/api/uploads/episodes?dryRun=0').attach('file', Buffer.from(text, 'utf8'), 'chunks.csv');
const many = (prefix: string, n: number, followUps = 1) => Array.from({ length: n }, (_, i) => episodeRows(`${prefix}${i}`, followUps)).flat();

describe('CSV upload written chunk by chunk', () => {
  it('a problem found in the last chunk, after earlier chunks were written, leaves nothing behind', async () => {
    const rows = many('CL-', 2500);
    rows.splice(rows.length - 2, 1); // the last episode loses its baseline: found only when its chunk is checked
    const before = await snapshot(ctx.db);
    const res = await send(csv(rows));
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(422);
    const row = rows.length + 1; // the header is line 1
    expect(res.body.errors).toEqual([
      { row, column: 'timepoint', message: expect.stringMatching(/“CL-2499” is new and has no baseline row/) },
      { row, column: 'assessed_on', message: 'Record the baseline assessment before any follow-up' },
    ]);
    expect(res.body).toMatchObject({ accepted: 4998, rejected: 1, uploadId: null });
    expect(await snapshot(ctx.db)).toEqual(before);
  });

  it('new episodes and new follow-ups of stored episodes in one file get the right parents, scores and interventions', async () => {
    expect((await send(csv(many('CM-', 1200, 0)))).status).toBe(200); // baselines only
    const file = [...many('CM-', 1200, 1), ...many('CN-', 1300, 2)];
    const res = await send(csv(file));
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(200);
    expect(res.body.changes).toEqual({ episodesCreated: 1300, episodesUpdated: 0, assessmentsCreated: 1200 + 3900, assessmentsUpdated: 0, rowsUnchanged: 1200 });
    const r = await ctx.db.execute<{ reference: string; timepoints: string; pain: string; groc: string; codes: string }>(sql`
      select e.reference,
        (select string_agg(a.timepoint, ' ' order by a.assessed_on) from assessment a where a.episode_id = e.id) as timepoints,
        (select string_agg(s.value::text, ' ' order by a.assessed_on) from assessment a join score s on s.assessment_id = a.id
          join instrument i on i.id = s.instrument_id and i.code = 'nprs-first-step' where a.episode_id = e.id) as pain,
        (select string_agg(s.value::text, ' ' order by a.assessed_on) from assessment a join score s on s.assessment_id = a.id
          join instrument i on i.id = s.instrument_id and i.code = 'groc' where a.episode_id = e.id) as groc,
        (select string_agg(c.code || ':' || coalesce(x.max_level::text, '-'), ' ' order by c.code) from episode_intervention x
          join intervention_code c on c.id = x.intervention_code_id where x.episode_id = e.id) as codes
      from episode e where e.clinic_id = ${clinicId} and e.reference in ('CM-0', 'CM-1199', 'CN-0', 'CN-1299')
      order by e.reference`);
    const codes = 'education-load:- fascia-stretch:- heel-raises:2';
    expect(r.rows).toEqual([
      { reference: 'CM-0', timepoints: 'baseline week6', pain: '7 5', groc: '2', codes },
      { reference: 'CM-1199', timepoints: 'baseline week6', pain: '7 5', groc: '2', codes },
      { reference: 'CN-0', timepoints: 'baseline week6 week12', pain: '7 5 2', groc: '2 -1', codes },
      { reference: 'CN-1299', timepoints: 'baseline week6 week12', pain: '7 5 2', groc: '2 -1', codes },
    ]);
    const n = await ctx.db.execute<{ a: number; s: number }>(sql`
      select count(distinct a.id)::int as a, count(s.*)::int as s from episode e join assessment a on a.episode_id = e.id
      left join score s on s.assessment_id = a.id where e.clinic_id = ${clinicId}`);
    // Baselines hold 3 scores (no GROC), follow-ups 4.
    expect(n.rows[0]).toEqual({ a: 2400 + 3900, s: (1200 + 1300) * 3 + (1200 + 2600) * 4 });
  });

  it('a file whose episodes are spread out (all baselines first) is read whole, after chunks were already written', async () => {
    // Rows of 1,500 episodes ordered by visit: the first chunk is planned (and written) before the follow-ups
    // of its episodes turn up, so the commit starts again reading the file whole; nothing may be doubled.
    // Not consenting: registry-wide research scans in other test files then meet no more rows than before.
    const visits = Array.from({ length: 1500 }, (_, i) => episodeRows(`CS-${i}`, 1, { research_consent: 'no' })).flat();
    const file = [...visits.filter((r) => r.timepoint === 'baseline'), ...visits.filter((r) => r.timepoint !== 'baseline')];
    const dry = await lead.post('/api/uploads/episodes?dryRun=1').attach('file', Buffer.from(csv(file), 'utf8'), 'spread.csv');
    expect(dry.body.changes).toEqual({ episodesCreated: 1500, episodesUpdated: 0, assessmentsCreated: 3000, assessmentsUpdated: 0, rowsUnchanged: 0 });
    const res = await send(csv(file));
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(200);
    expect(res.body.changes).toEqual(dry.body.changes);
    const n = await ctx.db.execute<{ e: number; a: number; s: number; i: number }>(sql`
      select count(distinct e.id)::int as e, count(distinct a.id)::int as a, count(s.*)::int as s,
        (select count(*)::int from episode_intervention x join episode y on y.id = x.episode_id where y.clinic_id = ${clinicId} and y.reference like 'CS-%') as i
      from episode e join assessment a on a.episode_id = e.id left join score s on s.assessment_id = a.id
      where e.clinic_id = ${clinicId} and e.reference like 'CS-%'`);
    expect(n.rows[0]).toEqual({ e: 1500, a: 3000, s: 1500 * 3 + 1500 * 4, i: 1500 * 3 });
    expect((await send(csv(file))).body.changes).toMatchObject({ episodesCreated: 0, assessmentsCreated: 0, rowsUnchanged: 3000 });
  });
});
