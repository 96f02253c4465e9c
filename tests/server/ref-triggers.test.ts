import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type pg from 'pg';
import { testApp } from '../setup/test-app';
import { createUser } from '../setup/auth';
import { createClinic, fakePseudonym } from './episodes-fixtures';

// The references of episode, assessment, score and episode_intervention are enforced by statement-level triggers
// (migration 0012) instead of foreign keys. They must refuse what a foreign key refuses, cascade what it
// cascades, and make a concurrent delete of a parent wait for (and then respect) a child being written.
const ctx = testApp();
let clinicId: number;
let userId: number;
let instrumentId: number;
let codeId: number;
afterAll(() => ctx.close());

const q = async <T extends pg.QueryResultRow = Record<string, unknown>>(text: string, values: unknown[] = [], on: pg.Pool | pg.PoolClient = ctx.pool) =>
  (await on.query<T>(text, values)).rows;
const error = (p: Promise<unknown>) => p.then(() => null, (e: { code?: string; message: string }) => e);

async function episode(reference: string): Promise<number> {
  const [e] = await q<{ id: number }>(
    `insert into episode (clinic_id, pseudonym, reference, condition_code, side, start_date, symptom_weeks, age_years, sex, height_cm,
       weight_kg, activity_profile, standing_work, research_consent, created_by, updated_by)
     values ($1, $2, $3, 'plantar-heel-pain', 'left', '2025-06-02', 10, 40, 'female', 170, 70, 'active', false, true, $4, $4) returning id`,
    [clinicId, fakePseudonym(reference), reference, userId],
  );
  return e!.id;
}
async function assessment(episodeId: number, on: pg.Pool | pg.PoolClient = ctx.pool): Promise<number> {
  const [a] = await q<{ id: number }>(
    `insert into assessment (episode_id, assessed_on, timepoint, reporter, created_by) values ($1, '2025-06-02', 'baseline', 'clinician', $2) returning id`,
    [episodeId, userId],
    on,
  );
  return a!.id;
}
/** Whether a backend is waiting for a lock (the concurrent delete or insert below). */
async function waitsForLock(pid: number): Promise<boolean> {
  for (let i = 0; i < 50; i++) {
    const [r] = await q<{ w: string | null }>('select wait_event_type as w from pg_stat_activity where pid = $1', [pid]);
    if (r?.w === 'Lock') return true;
    await new Promise((res) => setTimeout(res, 40));
  }
  return false;
}

beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'REF')).id;
  userId = (await createUser(ctx.db, 'lead', clinicId)).id;
  instrumentId = (await q<{ id: number }>(`select id from instrument where code = 'nprs-usual'`))[0]!.id;
  codeId = (await q<{ id: number }>('select id from intervention_code order by id limit 1'))[0]!.id;
});

describe('reference triggers', () => {
  it('refuse a child whose parent does not exist, on insert and on update, as a foreign key does (23503)', async () => {
    const e = await episode(`RF-${Date.now()}`);
    const a = await assessment(e);
    const missing = 2_000_000_000;
    const refused = [
      await error(q('insert into score (assessment_id, instrument_id, value) values ($1, $2, 3)', [missing, instrumentId])),
      await error(q('insert into score (assessment_id, instrument_id, value) values ($1, $2, 3)', [a, missing])),
      await error(q(`insert into assessment (episode_id, assessed_on, timepoint, reporter) values ($1, '2025-07-01', 'week6', 'patient')`, [missing])),
      await error(q('insert into episode_intervention (episode_id, intervention_code_id) values ($1, $2)', [e, missing])),
      await error(q(`update episode set condition_code = 'no-such-condition' where id = $1`, [e])),
      await error(q('update assessment set created_by = $2 where id = $1', [a, missing])),
    ];
    for (const r of refused) expect(r).toMatchObject({ code: '23503', message: expect.stringMatching(/violates foreign key constraint/) });
    // Rows with their parents in place, including parents written by the same statement, are accepted.
    await q('insert into score (assessment_id, instrument_id, value) values ($1, $2, 3)', [a, instrumentId]);
    const [n] = await q<{ n: number }>(
      `with e as (insert into episode (clinic_id, pseudonym, reference, condition_code, side, start_date, symptom_weeks, age_years, sex,
         height_cm, weight_kg, activity_profile, standing_work, research_consent) values ($1, $2, $3, 'plantar-heel-pain', 'left',
         '2025-06-02', 1, 30, 'male', 180, 80, 'active', true, true) returning id)
       insert into episode_intervention (episode_id, intervention_code_id) select id, $4 from e returning 1 as n`,
      [clinicId, fakePseudonym(`RS-${Date.now()}`), `RS-${Date.now()}`, codeId],
    );
    expect(n).toEqual({ n: 1 });
  });

  it('cascade deletes of episodes and assessments, and refuse deleting or re-keying a referenced parent', async () => {
    const e = await episode(`RC-${Date.now()}`);
    const a = await assessment(e);
    await q('insert into score (assessment_id, instrument_id, value) values ($1, $2, 4)', [a, instrumentId]);
    await q('insert into episode_intervention (episode_id, intervention_code_id) values ($1, $2)', [e, codeId]);
    expect(await error(q('delete from instrument where id = $1', [instrumentId]))).toMatchObject({ code: '23503' });
    expect(await error(q('delete from intervention_code where id = $1', [codeId]))).toMatchObject({ code: '23503' });
    expect(await error(q('delete from clinic where id = $1', [clinicId]))).toMatchObject({ code: '23503' });
    expect(await error(q('update assessment set id = -id where id = $1', [a]))).toMatchObject({ code: '23503' });
    await q('delete from episode where id = $1', [e]);
    const left = await q(
      `select (select count(*) from assessment where episode_id = $1)::int as a, (select count(*) from score where assessment_id = $2)::int as s,
        (select count(*) from episode_intervention where episode_id = $1)::int as i`,
      [e, a],
    );
    expect(left).toEqual([{ a: 0, s: 0, i: 0 }]);
  });

  it('make a parent delete wait for a child being written, then take the committed child with it', async () => {
    const e = await episode(`RW-${Date.now()}`);
    const a = await assessment(e);
    const writer = await ctx.pool.connect();
    const deleter = await ctx.pool.connect();
    try {
      await writer.query('begin');
      await writer.query('insert into score (assessment_id, instrument_id, value) values ($1, $2, 5)', [a, instrumentId]);
      const pid = (await q<{ pid: number }>('select pg_backend_pid() as pid', [], deleter))[0]!.pid;
      const deleting = deleter.query('delete from assessment where id = $1', [a]);
      expect(await waitsForLock(pid)).toBe(true);
      await writer.query('commit');
      await deleting;
      expect(await q('select * from score where assessment_id = $1', [a])).toEqual([]);
    } finally {
      writer.release();
      deleter.release();
    }
  });

  it('refuse a child whose parent is deleted by a transaction that commits while the child waits', async () => {
    const e = await episode(`RD-${Date.now()}`);
    const a = await assessment(e);
    const writer = await ctx.pool.connect();
    const deleter = await ctx.pool.connect();
    try {
      await deleter.query('begin');
      await deleter.query('delete from assessment where id = $1', [a]);
      const pid = (await q<{ pid: number }>('select pg_backend_pid() as pid', [], writer))[0]!.pid;
      const writing = error(writer.query('insert into score (assessment_id, instrument_id, value) values ($1, $2, 5)', [a, instrumentId]));
      expect(await waitsForLock(pid)).toBe(true);
      await deleter.query('commit');
      expect(await writing).toMatchObject({ code: '23503' });
      expect(await q('select * from score where assessment_id = $1', [a])).toEqual([]);
    } finally {
      writer.release();
      deleter.release();
    }
  });
});
