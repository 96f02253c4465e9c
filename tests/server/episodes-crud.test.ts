import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, desc, eq } from 'drizzle-orm';
import { auditEvents, instruments } from '../../server/db/schema';
import { EpisodeDetailSchema, EpisodeListSchema } from '../../shared/schemas/episode';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { createClinic, episodeInput, snapshot } from './episodes-fixtures';

const ctx = testApp();
let clinicId: number;
let lead: Client;
let clinician: Client;
afterAll(() => ctx.close());
beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'CRUD')).id;
  lead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', clinicId)).email);
  clinician = await signedInClient(ctx.app, (await createUser(ctx.db, 'clinician', clinicId)).email);
});

const lastAudit = async (entity: string, entityId: number) =>
  (await ctx.db.select().from(auditEvents).where(and(eq(auditEvents.entity, entity), eq(auditEvents.entityId, String(entityId)))).orderBy(desc(auditEvents.id)).limit(1))[0];

describe('episodes: create, read, update', () => {
  it('creates an episode with its baseline and interventions, audited, and reads it back with BMI', async () => {
    const input = episodeInput({ heightCm: 180, weightKg: 81 });
    const res = await clinician.post('/api/episodes').send(input);
    expect(res.status).toBe(201);
    const e = EpisodeDetailSchema.parse(res.body);
    expect(e).toMatchObject({ clinicId, reference: input.reference, version: 1, status: 'open', bmi: 25, bmiBand: 'overweight' });
    expect(e.assessments).toEqual([expect.objectContaining({ timepoint: 'baseline', daysSinceStart: 0, scores: { 'nprs-first-step': 7, 'nprs-usual': 5, 'faam-adl': 60 } })]);
    expect(e.interventions.map((i) => [i.code, i.maxLevel])).toEqual([['education-load', null], ['heel-raises', 2]]);
    expect((await lead.get(`/api/episodes/${e.id}`)).body).toEqual(res.body);
    const a = await lastAudit('episode', e.id);
    expect(a).toMatchObject({ action: 'create', clinicId, detail: expect.objectContaining({ reference: input.reference }) });
    expect(JSON.stringify(a!.detail)).not.toContain(input.pseudonym);
  });

  it('lists episodes with weeks in care, latest first-step pain and the change so far', async () => {
    const input = episodeInput({ startDate: '2026-01-05', baseline: { assessedOn: '2026-01-05', scores: { 'nprs-first-step': 8 } } });
    const id = (await clinician.post('/api/episodes').send(input)).body.id as number;
    expect((await clinician.post(`/api/episodes/${id}/assessments`).send({ assessedOn: '2026-02-16', timepoint: 'week6', scores: { 'nprs-first-step': 5, groc: 3 } })).status).toBe(201);
    const res = await clinician.get(`/api/episodes?q=${input.reference}`);
    expect(res.status).toBe(200);
    const list = EpisodeListSchema.parse(res.body);
    expect(list.total).toBe(1);
    expect(list.items[0]).toMatchObject({ id, latestFirstStepPain: 5, firstStepPainChange: -3, lastAssessedOn: '2026-02-16', version: 1 });
    expect(list.items[0]!.weeksInCare).toBeGreaterThan(40);
    const page = EpisodeListSchema.parse((await clinician.get('/api/episodes?limit=1&sort=reference&order=asc')).body);
    expect(page.items).toHaveLength(1);
    expect(page.total).toBeGreaterThanOrEqual(2);
  });

  it('patches with optimistic locking: the version increments, a stale version is 409, the audit names the changed fields', async () => {
    const e = (await clinician.post('/api/episodes').send(episodeInput())).body;
    const ok = await lead.patch(`/api/episodes/${e.id}`).send({ version: 1, weightKg: 76, ageYears: 45 });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ version: 2, weightKg: 76, ageYears: 45 });
    const audit = await lastAudit('episode', e.id);
    expect(audit).toMatchObject({ action: 'update', detail: expect.objectContaining({ changes: { weightKg: { from: 70, to: 76 }, ageYears: { from: 44, to: 45 } } }) });
    const stale = await clinician.patch(`/api/episodes/${e.id}`).send({ version: 1, weightKg: 90 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/changed by someone else.*your version 1, now 2/);
    expect((await lead.get(`/api/episodes/${e.id}`)).body.weightKg).toBe(76);
  });

  it('of two PATCHes with the same version, exactly one wins', async () => {
    const e = (await clinician.post('/api/episodes').send(episodeInput())).body;
    const [a, b] = await Promise.all([
      lead.patch(`/api/episodes/${e.id}`).send({ version: 1, symptomWeeks: 20 }),
      clinician.patch(`/api/episodes/${e.id}`).send({ version: 1, symptomWeeks: 30 }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const winner = a.status === 200 ? 20 : 30;
    expect((await lead.get(`/api/episodes/${e.id}`)).body).toMatchObject({ version: 2, symptomWeeks: winner });
  });

  it('discharges through PATCH (status, date and reason) and refuses an incoherent discharge', async () => {
    const e = (await clinician.post('/api/episodes').send(episodeInput())).body;
    const missing = await clinician.patch(`/api/episodes/${e.id}`).send({ version: 1, status: 'discharged' });
    expect(missing.status).toBe(422);
    expect(missing.body.error.issues.map((i: { path: string[] }) => i.path[0])).toEqual(['dischargeDate', 'dischargeReason']);
    const before = await clinician.patch(`/api/episodes/${e.id}`).send({ version: 1, status: 'discharged', dischargeDate: '2026-01-01', dischargeReason: 'recovered' });
    expect(before.status).toBe(422);
    expect(before.body.error.message).toMatch(/before the episode’s start/);
    const done = await clinician.patch(`/api/episodes/${e.id}`).send({ version: 1, status: 'discharged', dischargeDate: '2026-06-01', dischargeReason: 'recovered' });
    expect(done.status).toBe(200);
    expect(done.body).toMatchObject({ status: 'discharged', dischargeDate: '2026-06-01', dischargeReason: 'recovered', version: 2 });
    const reopened = await clinician.patch(`/api/episodes/${e.id}`).send({ version: 2, status: 'open' });
    expect(reopened.body).toMatchObject({ status: 'open', dischargeDate: null, dischargeReason: null, version: 3 });
  });

  it('a PATCH that changes nothing writes nothing', async () => {
    const e = (await clinician.post('/api/episodes').send(episodeInput())).body;
    const snap = await snapshot(ctx.db);
    const res = await clinician.patch(`/api/episodes/${e.id}`).send({ version: 1, ageYears: 44 });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(1);
    expect(await snapshot(ctx.db)).toEqual(snap);
  });

  it('records interventions (levels only on graded codes) with an audit of what was added and removed', async () => {
    const e = (await clinician.post('/api/episodes').send(episodeInput())).body;
    const snap = await snapshot(ctx.db);
    const bad = await clinician.put(`/api/episodes/${e.id}/interventions`).send({ interventions: [{ code: 'taping', maxLevel: 2 }] });
    expect(bad.status).toBe(422);
    expect(bad.body.error.message).toMatch(/“taping” \(Taping\) has no levels/);
    const unknown = await clinician.put(`/api/episodes/${e.id}/interventions`).send({ interventions: [{ code: 'cold-plunge' }] });
    expect(unknown.status).toBe(422);
    expect(await snapshot(ctx.db)).toEqual(snap);
    const ok = await clinician.put(`/api/episodes/${e.id}/interventions`).send({
      interventions: [{ code: 'education-load' }, { code: 'split-squats', maxLevel: 3, startWeek: 4 }, { code: 'taping' }],
    });
    expect(ok.status).toBe(200);
    expect(ok.body.interventions.map((i: { code: string }) => i.code)).toEqual(['education-load', 'split-squats', 'taping']);
    expect((await lastAudit('episode-interventions', e.id))?.detail).toMatchObject({ added: ['split-squats', 'taping'], removed: ['heel-raises'] });
  });
});

describe('episodes: assessments', () => {
  it('refuses a second baseline (409), a follow-up before the baseline, out-of-range and retired or unknown scores (422), writing nothing', async () => {
    const e = (await clinician.post('/api/episodes').send(episodeInput())).body;
    const snap = await snapshot(ctx.db);
    const second = await clinician.post(`/api/episodes/${e.id}/assessments`).send({ assessedOn: '2026-03-09', timepoint: 'baseline', scores: { 'nprs-first-step': 6 } });
    expect(second.status).toBe(409);
    expect(second.body.error.message).toMatch(/already has its baseline \(2026-03-02\)/);
    const early = await clinician.post(`/api/episodes/${e.id}/assessments`).send({ assessedOn: '2026-02-20', timepoint: 'week6', scores: { 'nprs-first-step': 6 } });
    expect(early.status).toBe(422);
    expect(early.body.error.message).toMatch(/cannot be dated before the baseline \(2026-03-02\)/);
    const range = await clinician.post(`/api/episodes/${e.id}/assessments`).send({ assessedOn: '2026-04-13', timepoint: 'week6', scores: { 'nprs-first-step': 11 } });
    expect(range.status).toBe(422);
    expect(range.body.error.message).toMatch(/\(nprs-first-step\) runs from 0 to 10; 11 is outside/);
    const unknown = await clinician.post(`/api/episodes/${e.id}/assessments`).send({ assessedOn: '2026-04-13', timepoint: 'week6', scores: { 'made-up': 3 } });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.message).toMatch(/Unknown instrument “made-up”/);
    const [retired] = await ctx.db.insert(instruments).values({ code: `retired-${e.id}`, label: 'Old scale', unit: 'points', min: 0, max: 10, higherIsBetter: true, mcidSource: 'test', bodyRegion: 'foot', retired: true }).returning();
    const old = await clinician.post(`/api/episodes/${e.id}/assessments`).send({ assessedOn: '2026-04-13', timepoint: 'week6', scores: { [retired!.code]: 3 } });
    await ctx.db.delete(instruments).where(eq(instruments.id, retired!.id));
    expect(old.status).toBe(422);
    expect(old.body.error.message).toMatch(/is retired/);
    const impossible = await clinician.post(`/api/episodes/${e.id}/assessments`).send({ assessedOn: '2026-02-30', timepoint: 'week6', scores: { groc: 2 } });
    expect(impossible.status).toBe(422);
    expect(await snapshot(ctx.db)).toEqual(snap);
  });

  it('adds a follow-up (GROC may be negative) with an audit event, and refuses the same one twice (409)', async () => {
    const e = (await clinician.post('/api/episodes').send(episodeInput())).body;
    const body = { assessedOn: '2026-04-13', timepoint: 'week6', reporter: 'patient', scores: { 'nprs-first-step': 6, groc: -2 }, avgDailySteps: 5400 };
    const res = await clinician.post(`/api/episodes/${e.id}/assessments`).send(body);
    expect(res.status).toBe(201);
    const a = res.body.assessments.find((x: { timepoint: string }) => x.timepoint === 'week6');
    expect(a).toMatchObject({ daysSinceStart: 42, reporter: 'patient', avgDailySteps: 5400, scores: { 'nprs-first-step': 6, groc: -2 } });
    expect(await lastAudit('assessment', a.id)).toMatchObject({ action: 'create', detail: expect.objectContaining({ episodeId: e.id, timepoint: 'week6' }) });
    expect((await clinician.post(`/api/episodes/${e.id}/assessments`).send(body)).status).toBe(409);
  });
});

describe('episodes: bad input on create', () => {
  it('answers 422 with a clear message and writes nothing', async () => {
    const snap = await snapshot(ctx.db);
    const cases: [Record<string, unknown>, RegExp][] = [
      [{ pseudonym: 'Jane Smith' }, /64 hexadecimal characters/],
      [{ pseudonym: 'abc123' }, /64 hexadecimal characters/],
      [{ reference: 'jane@example.org' }, /looks like an e-mail/],
      [{ reference: '+44 20 7946 0958' }, /looks like a phone number/],
      [{ reference: 'P-12/03/1961' }, /looks like a date/],
      [{ startDate: '2026-02-30' }, /does not exist/],
      [{ baseline: { assessedOn: '2026-03-01', scores: { 'nprs-first-step': 5 } } }, /cannot be dated before the episode’s start/],
      [{ baseline: { assessedOn: '2026-03-02', scores: { 'faam-adl': 101 } } }, /runs from 0 to 100; 101 is outside/],
      [{ interventions: [{ code: 'heel-raises', maxLevel: 4 }] }, /./],
      [{ ageYears: 12 }, /adults/],
    ];
    for (const [over, message] of cases) {
      const res = await clinician.post('/api/episodes').send(episodeInput(over));
      expect(res.status, JSON.stringify(over)).toBe(422);
      expect(JSON.stringify(res.body.error), JSON.stringify(over)).toMatch(message);
    }
    expect(await snapshot(ctx.db)).toEqual(snap);
  });

  it('refuses a duplicate reference in the same clinic with 409', async () => {
    const input = episodeInput();
    expect((await clinician.post('/api/episodes').send(input)).status).toBe(201);
    const again = await clinician.post('/api/episodes').send({ ...input, pseudonym: episodeInput().pseudonym });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already has an episode with the reference/);
  });
});
