import { beforeAll, describe, expect, it } from 'vitest';
import { Writable } from 'node:stream';
import { eq } from 'drizzle-orm';
import { dataRequests, exportLog } from '../../server/db/schema';
import { scopeOf } from '../../server/db/scope';
import { streamExport } from '../../server/services/exports/stream-export';
import { testAppWithMail } from '../setup/mail';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { addDays, randomSpecs, seedDataset, type Dataset } from './exports-fixtures';
import { approvedRequest, download } from './exports-helpers';

const ctx = testAppWithMail();
let data: Dataset;
let researcher: Client;
let researcherUser: Awaited<ReturnType<typeof createUser>>;
let other: Client;
let steward: Client;
let stewardEmail: string;

beforeAll(async () => {
  data = await seedDataset(ctx.db, ['Test Hills', 'Test Plain'], randomSpecs(60, 2, 1234));
  researcherUser = await createUser(ctx.db, 'researcher');
  researcher = await signedInClient(ctx.app, researcherUser.email);
  other = await signedInClient(ctx.app, (await createUser(ctx.db, 'researcher')).email);
  stewardEmail = (await createUser(ctx.db, 'steward')).email;
  steward = await signedInClient(ctx.app, stewardEmail);
});

async function pendingRequest(client = researcher) {
  const cohort = await client
    .post('/api/cohorts')
    .send({ name: 'Requested cohort', criteria: { conditionCode: data.condition } });
  const res = await client.post('/api/data-requests').send({
    cohortId: cohort.body.id,
    purpose: 'Recovery of runners compared with sedentary people over the first six months',
    variableGroups: ['recovery', 'subgroups'],
  });
  expect(res.status).toBe(201);
  return { id: res.body.id as number, cohortId: cohort.body.id as number };
}

describe('data requests', () => {
  it('are made by a researcher from their own saved cohort, with a purpose', async () => {
    const { id } = await pendingRequest();
    const list = await researcher.get('/api/data-requests');
    const item = list.body.items.find((r: { id: number }) => r.id === id);
    expect(item).toMatchObject({
      status: 'pending',
      downloadable: false,
      variableGroups: ['core', 'recovery', 'subgroups'],
    });
    const foreign = await other
      .post('/api/cohorts')
      .send({ name: 'Theirs', criteria: { conditionCode: data.condition } });
    expect(
      (await researcher.post('/api/data-requests').send({ cohortId: foreign.body.id, purpose: 'x'.repeat(40) })).status,
    ).toBe(404);
    expect(
      (await researcher.post('/api/data-requests').send({ cohortId: foreign.body.id, purpose: 'too short' })).status,
    ).toBe(422);
    expect(
      (
        await researcher
          .post('/api/data-requests')
          .send({ cohortId: foreign.body.id, purpose: 'x'.repeat(40), variableGroups: ['pseudonyms'] })
      ).status,
    ).toBe(422);
    expect(
      (await steward.post('/api/data-requests').send({ cohortId: foreign.body.id, purpose: 'x'.repeat(40) })).status,
    ).toBe(403);
    expect((await other.get('/api/data-requests')).body.items.some((r: { id: number }) => r.id === id)).toBe(false);
    expect((await steward.get('/api/data-requests')).body.items.some((r: { id: number }) => r.id === id)).toBe(true);
  });

  it('are approved by the steward with conditions, and both sides get an e-mail', async () => {
    const { id } = await pendingRequest();
    ctx.mail.clear();
    expect(
      (await steward.post(`/api/data-requests/${id}/approve`).send({ expiresOn: '2099-01-31', k: 2 })).status,
    ).toBe(422);
    expect((await steward.post(`/api/data-requests/${id}/approve`).send({ expiresOn: '2001-01-31' })).status).toBe(422);
    expect((await researcher.post(`/api/data-requests/${id}/approve`).send({ expiresOn: '2099-01-31' })).status).toBe(
      403,
    );
    const ok = await steward
      .post(`/api/data-requests/${id}/approve`)
      .send({ expiresOn: '2099-01-31', startGranularity: 'quarter' });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({
      status: 'approved',
      k: 5,
      startGranularity: 'quarter',
      allowRawBmi: false,
      expiresOn: '2099-01-31',
    });
    expect(ctx.mail.lastTo(researcherUser.email).subject).toMatch(new RegExp(`#${id} approved`));
    expect(ctx.mail.lastTo(stewardEmail).text).toMatch(/2099-01-31/);
    expect((await steward.post(`/api/data-requests/${id}/decline`).send({ reason: 'changed my mind' })).status).toBe(
      409,
    );
    const mine = (await researcher.get('/api/data-requests')).body.items.find((r: { id: number }) => r.id === id);
    expect(mine.downloadable).toBe(true);
  });

  it('are declined with a reason that reaches the researcher', async () => {
    const { id } = await pendingRequest();
    expect((await steward.post(`/api/data-requests/${id}/decline`).send({ reason: '' })).status).toBe(422);
    const res = await steward
      .post(`/api/data-requests/${id}/decline`)
      .send({ reason: 'The purpose needs an ethics approval number' });
    expect(res.body).toMatchObject({
      status: 'declined',
      declineReason: 'The purpose needs an ethics approval number',
    });
    const mail = ctx.mail.lastTo(researcherUser.email);
    expect(mail.subject).toMatch(/declined/);
    expect(mail.text).toMatch(/ethics approval number/);
    expect((await researcher.get(`/api/data-requests/${id}/export.csv`)).status).toBe(403);
  });
});

describe('download rights', () => {
  it('belong to the requester only, once approved and until the expiry day', async () => {
    const { id } = await pendingRequest();
    expect((await researcher.get(`/api/data-requests/${id}/export.csv`)).status).toBe(403);
    expect((await researcher.get(`/api/data-requests/${id}/dictionary?format=md`)).status).toBe(403);
    await steward.post(`/api/data-requests/${id}/approve`).send({ expiresOn: '2099-01-31' });
    expect((await other.get(`/api/data-requests/${id}/export.csv`)).status).toBe(403);
    expect((await other.get(`/api/data-requests/${id}/dictionary?format=csv`)).status).toBe(403);
    expect((await steward.get(`/api/data-requests/${id}/export.csv`)).status).toBe(403);
    expect((await researcher.get('/api/data-requests/999999/export.csv')).status).toBe(404);
    expect((await researcher.get(`/api/data-requests/${id}/dictionary?format=pdf`)).status).toBe(422);
    expect((await download(researcher, `/api/data-requests/${id}/export.csv`)).status).toBe(200);
    const today = new Date().toISOString().slice(0, 10);
    await ctx.db.update(dataRequests).set({ expiresOn: today }).where(eq(dataRequests.id, id));
    expect((await download(researcher, `/api/data-requests/${id}/export.csv`)).status).toBe(200);
    await ctx.db
      .update(dataRequests)
      .set({ expiresOn: addDays(today, -1) })
      .where(eq(dataRequests.id, id));
    const expired = await researcher.get(`/api/data-requests/${id}/export.csv`);
    expect(expired.status).toBe(403);
    expect(expired.body.error.message).toMatch(/expired/);
  });

  it('audits a download the client abandons as aborted', async () => {
    const id = await approvedRequest(researcher, steward, data.condition);
    let chunks = 0;
    // A client that goes away after the first chunk, as a closed browser tab does.
    const out = new Writable({
      write(_chunk, _enc, done) {
        chunks++;
        done();
        if (chunks === 1) this.destroy();
      },
    });
    const scope = scopeOf({
      id: researcherUser.id,
      email: researcherUser.email,
      name: '',
      role: 'researcher',
      clinicId: null,
    });
    await streamExport(ctx.db, scope, id, { out, begin: () => undefined }, () => undefined);
    const [log] = await ctx.db.select().from(exportLog).where(eq(exportLog.requestId, id));
    expect(log!.status).toBe('aborted');
    expect(log!.rowCount).toBeLessThanOrEqual(data.episodes.filter((e) => e.consent).length);
    expect(log!.byteCount).toBeGreaterThan(0);
    expect(log!.sha256).toMatch(/^[0-9a-f]{64}$/);
  });
});
