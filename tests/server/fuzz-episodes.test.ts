import fc from 'fast-check';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EpisodeCreateSchema } from '../../shared/schemas/episode';
import { consistencyProblems } from '../setup/consistency';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { testApp } from '../setup/test-app';
import { createClinic } from './episodes-fixtures';
import { EDGES, invalidStoredEpisodes, mutatedEpisode, nasty, validEpisode } from './fuzz-arbitraries';

// Random and boundary values against the real episode API: every answer is 2xx or a 4xx in the JSON error shape,
// never a 5xx; a refused request writes nothing; whatever was stored passes the checks a new episode must pass.
const ctx = testApp();
let client: Client;
let clinicId: number;
let episodeId: number;
let n = 0;
const nextReference = () => `FZ${(n++).toString(36)}x`;

beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'FUZZ')).id;
  client = await signedInClient(ctx.app, (await createUser(ctx.db, 'clinician', clinicId)).email);
  const created = await client.post('/api/episodes').send(validEpisode(nextReference()));
  expect(created.status).toBe(201);
  episodeId = created.body.id;
});
afterAll(() => ctx.close());

/** Rows of the clinic's data: equal before and after means nothing was written. */
async function counts() {
  const r = await ctx.db.execute(sql`select
    (select count(*) from episode where clinic_id = ${clinicId}) as e,
    (select count(*) from assessment a join episode e on e.id = a.episode_id where e.clinic_id = ${clinicId}) as a,
    (select count(*) from score s join assessment a on a.id = s.assessment_id join episode e on e.id = a.episode_id where e.clinic_id = ${clinicId}) as s,
    (select count(*) from episode_intervention i join episode e on e.id = i.episode_id where e.clinic_id = ${clinicId}) as i,
    (select max(version) from episode where clinic_id = ${clinicId}) as v,
    (select count(*) from audit_event where clinic_id = ${clinicId}) as audit`);
  return r.rows[0];
}

/** The answer is a success, or a client error in the one error shape; a refusal changed nothing. */
async function checkAnswer(res: { status: number; body: unknown }, before: unknown) {
  expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBeLessThan(500);
  if (res.status >= 400) {
    expect(res.body).toMatchObject({ error: { message: expect.any(String) } });
    expect((res.body as { error: { message: string } }).error.message.length).toBeGreaterThan(0);
    expect(await counts()).toEqual(before);
  } else {
    expect(res.status).toBeGreaterThanOrEqual(200);
  }
}

describe('fuzzing the episode API', () => {
  it('new episodes with random and boundary values in one to four fields', async () => {
    let accepted = 0;
    await fc.assert(
      fc.asyncProperty(mutatedEpisode(nextReference), async (body) => {
        const before = await counts();
        const res = await client.post('/api/episodes').send(body);
        await checkAnswer(res, before);
        if (res.status === 201) {
          accepted++;
          // Accepted only what the shared schema accepts.
          expect(EpisodeCreateSchema.safeParse(body).success, JSON.stringify(body)).toBe(true);
        }
      }),
      { numRuns: 250 },
    );
    expect(accepted).toBeGreaterThan(0); // some mutations are harmless (e.g. another valid age): the check has teeth
  });

  it('request bodies of any JSON, and bytes that are not JSON', async () => {
    await fc.assert(
      fc.asyncProperty(fc.oneof(nasty, fc.jsonValue()), async (body) => {
        const before = await counts();
        await checkAnswer(await client.post('/api/episodes').send(JSON.stringify(body) ?? 'null').set('content-type', 'application/json'), before);
      }),
      { numRuns: 80 },
    );
    for (const raw of ['{', '{"pseudonym":', '\u0000', 'null', '[]', '"x"', '{"a":1}}', '\uFEFF{}']) {
      const before = await counts();
      await checkAnswer(await client.post('/api/episodes').set('content-type', 'application/json').send(raw), before);
    }
  });

  it('changes (PATCH) and follow-ups with random values and versions', async () => {
    const fields = ['symptomWeeks', 'ageYears', 'heightCm', 'weightKg', 'status', 'dischargeDate', 'dischargeReason', 'reference', 'pseudonym', 'startDate', 'sex', 'version', 'unknownField'];
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.constantFrom(...fields).chain((f) => fc.tuple(fc.constant(f), EDGES[f] ? fc.oneof(nasty, fc.constantFrom(...EDGES[f]!)) : nasty)), { minLength: 1, maxLength: 3 }).map((kv) => Object.fromEntries(kv)),
        fc.boolean(),
        async (patch, currentVersion) => {
          const [{ version }] = (await ctx.db.execute<{ version: number }>(sql`select version from episode where id = ${episodeId}`)).rows as [{ version: number }];
          const body = currentVersion && !('version' in patch) ? { ...patch, version } : patch;
          const before = await counts();
          await checkAnswer(await client.patch(`/api/episodes/${episodeId}`).send(body), before);
        },
      ),
      { numRuns: 120 },
    );
    await fc.assert(
      fc.asyncProperty(
        fc.record({ assessedOn: nasty, timepoint: fc.oneof(fc.constantFrom('week6', 'week12', 'baseline', 'interim'), nasty), scores: fc.oneof(nasty, fc.dictionary(fc.constantFrom('nprs-first-step', 'groc', 'lefs', 'nope'), nasty)) }, { requiredKeys: [] }),
        async (body) => {
          const before = await counts();
          await checkAnswer(await client.post(`/api/episodes/${episodeId}/assessments`).send(body), before);
        },
      ),
      { numRuns: 100 },
    );
    for (const id of ['0', '-1', 'abc', '1e3', '99999999999', '%00']) {
      const before = await counts();
      await checkAnswer(await client.get(`/api/episodes/${id}`), before);
      await checkAnswer(await client.patch(`/api/episodes/${id}`).send({ version: 1, ageYears: 40 }), before);
    }
  });

  it('everything stored is valid, and the database is consistent', async () => {
    expect(await invalidStoredEpisodes(ctx.db, clinicId)).toEqual([]);
    expect(await consistencyProblems(ctx.db, [clinicId])).toEqual([]);
  });
});
