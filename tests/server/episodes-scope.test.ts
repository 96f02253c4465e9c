import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { createClinic, episodeInput, snapshot } from './episodes-fixtures';

const ctx = testApp();
let a: { id: number };
let b: { id: number };
let clinicianA: Client;
let clinicianB: Client;
let steward: Client;
let researcher: Client;
let episodeB: { id: number; reference: string };
afterAll(() => ctx.close());
beforeAll(async () => {
  a = await createClinic(ctx.db, 'SCA');
  b = await createClinic(ctx.db, 'SCB');
  clinicianA = await signedInClient(ctx.app, (await createUser(ctx.db, 'clinician', a.id)).email);
  clinicianB = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', b.id)).email);
  steward = await signedInClient(ctx.app, (await createUser(ctx.db, 'steward')).email);
  researcher = await signedInClient(ctx.app, (await createUser(ctx.db, 'researcher')).email);
  await clinicianA.post('/api/episodes').send(episodeInput());
  episodeB = (await clinicianB.post('/api/episodes').send(episodeInput())).body;
});

describe('episodes: clinic isolation', () => {
  it('a clinician of clinic A sees only clinic A in the list, even when searching for B’s reference', async () => {
    const all = await clinicianA.get('/api/episodes?limit=200');
    expect(all.status).toBe(200);
    expect(all.body.items.every((e: { clinicId: number }) => e.clinicId === a.id)).toBe(true);
    const search = await clinicianA.get(`/api/episodes?q=${episodeB.reference}`);
    expect(search.body).toEqual({ items: [], total: 0 });
    const other = await clinicianA.get(`/api/episodes?clinicId=${b.id}`);
    expect(other.body.items.every((e: { clinicId: number }) => e.clinicId === a.id)).toBe(true);
  });

  it('another clinic’s episode is 404 (not 403) for read, patch, assessments and interventions, and nothing changes', async () => {
    const snap = await snapshot(ctx.db);
    const answers = await Promise.all([
      clinicianA.get(`/api/episodes/${episodeB.id}`),
      clinicianA.patch(`/api/episodes/${episodeB.id}`).send({ version: 1, ageYears: 50 }),
      clinicianA.post(`/api/episodes/${episodeB.id}/assessments`).send({ assessedOn: '2026-04-13', timepoint: 'week6', scores: { groc: 1 } }),
      clinicianA.put(`/api/episodes/${episodeB.id}/interventions`).send({ interventions: [] }),
    ]);
    expect(answers.map((r) => r.status)).toEqual([404, 404, 404, 404]);
    const missing = await clinicianA.get('/api/episodes/999999999');
    expect(missing.body).toEqual(answers[0]!.body);
    expect(await snapshot(ctx.db)).toEqual(snap);
  });

  it('the steward reads every clinic and can filter one, but cannot write', async () => {
    const one = await steward.get(`/api/episodes?clinicId=${b.id}`);
    expect(one.status).toBe(200);
    expect(one.body.items.map((e: { id: number }) => e.id)).toEqual([episodeB.id]);
    expect((await steward.get(`/api/episodes/${episodeB.id}`)).status).toBe(200);
    expect((await steward.post('/api/episodes').send(episodeInput())).status).toBe(403);
    expect((await steward.patch(`/api/episodes/${episodeB.id}`).send({ version: 1, ageYears: 50 })).status).toBe(403);
  });

  it('a researcher gets 403 from every episode and upload route, but may read instruments and interventions', async () => {
    const res = await Promise.all([
      researcher.get('/api/episodes'),
      researcher.get(`/api/episodes/${episodeB.id}`),
      researcher.post('/api/episodes').send(episodeInput()),
      researcher.patch(`/api/episodes/${episodeB.id}`).send({ version: 1 }),
      researcher.get('/api/uploads'),
      researcher.post('/api/uploads/episodes?dryRun=1'),
      researcher.get('/api/clinics/current/pseudonym-salt'),
    ]);
    expect(res.map((r) => r.status)).toEqual([403, 403, 403, 403, 403, 403, 403]);
    expect((await researcher.get('/api/instruments')).status).toBe(200);
    expect((await researcher.get('/api/interventions')).status).toBe(200);
  });

  it('signed out is 401', async () => {
    const { anonymousClient } = await import('../setup/auth');
    const anon = await anonymousClient(ctx.app);
    expect((await anon.get('/api/episodes')).status).toBe(401);
  });
});
