import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { episodes } from '../../server/db/schema';
import { ageBand, bmi, bmiBand } from '../../analysis';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { randomSpecs, seedDataset, type Dataset } from './exports-fixtures';
import { smallCellValues } from './attrition-leak';

const ctx = testApp();
let data: Dataset;
let researcher: Client;
let otherResearcher: Client;
let steward: Client;

beforeAll(async () => {
  data = await seedDataset(ctx.db, ['Test Coast', 'Test Valley', 'Test Coast'], randomSpecs(90, 3, 424242));
  researcher = await signedInClient(ctx.app, (await createUser(ctx.db, 'researcher')).email);
  otherResearcher = await signedInClient(ctx.app, (await createUser(ctx.db, 'researcher')).email);
  steward = await signedInClient(ctx.app, (await createUser(ctx.db, 'steward')).email);
});
afterAll(() => ctx.close());

const mine = (extra: Record<string, unknown> = {}) => ({ conditionCode: data.condition, ...extra });

describe('cohort preview', () => {
  it('refuses a criteria object that tries to turn research consent off', async () => {
    const res = await steward.post('/api/cohorts/preview').send({ criteria: mine({ researchConsent: false }) });
    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body.error.issues)).toMatch(/researchConsent/);
    const saved = await researcher
      .post('/api/cohorts')
      .send({ name: 'No consent?', criteria: mine({ researchConsent: false }) });
    expect(saved.status).toBe(422);
  });

  it('counts only consenting episodes, and the flow diagram adds up', async () => {
    const criteria = mine({ activityProfiles: ['runner', 'active'], sexes: ['female'] });
    const res = await steward.post('/api/cohorts/preview').send({ criteria });
    expect(res.status).toBe(200);
    const expected = data.episodes.filter(
      (e) => e.consent && ['runner', 'active'].includes(e.activityProfile) && e.sex === 'female',
    ).length;
    expect(expected).toBeGreaterThan(0);
    expect(res.body.count).toBe(expected);
    const steps = res.body.attrition as { step: string; excluded: number; remaining: number }[];
    expect(steps.map((s) => s.step)).toEqual(['registry', 'consent', 'condition', 'activity', 'sex']);
    const start = steps[0]!.remaining;
    const excludedTotal = steps.slice(1).reduce((sum, s) => sum + s.excluded, 0);
    expect(start - excludedTotal).toBe(expected);
    for (let i = 1; i < steps.length; i++)
      expect(steps[i]!.remaining).toBe(steps[i - 1]!.remaining - steps[i]!.excluded);
    // Within our own condition, the later steps remove exactly what the source rows say.
    const ours = data.episodes.filter((e) => e.consent);
    const afterActivity = ours.filter((e) => ['runner', 'active'].includes(e.activityProfile));
    expect(steps[3]!.excluded).toBe(ours.length - afterActivity.length);
    expect(steps[4]!.excluded).toBe(afterActivity.length - expected);
    expect(res.body.clinics).toBe(new Set(data.episodes.filter((e) => e.consent).map((e) => e.clinic)).size);
  });

  it('applies the band criteria with the outcomes engine (BMI and age bands)', async () => {
    const res = await steward
      .post('/api/cohorts/preview')
      .send({ criteria: mine({ bmiBands: ['overweight', 'obese'], ageBands: ['40-44', '45-49', '50-54'] }) });
    const expected = data.episodes.filter(
      (e) =>
        e.consent &&
        ['overweight', 'obese'].includes(bmiBand(bmi(e.heightCm, e.weightKg))) &&
        ['40-44', '45-49', '50-54'].includes(ageBand(e.ageYears)),
    ).length;
    expect(expected).toBeGreaterThan(0);
    expect(res.body.count).toBe(expected);
  });

  it('filters on baseline severity, instrument completeness and add-ons', async () => {
    const criteria = mine({
      baselinePain: { min: 6, max: 9 },
      completeInstrument: 'nprs-first-step',
      addOns: { codes: ['toe-flexor'], match: 'any' },
    });
    const res = await steward.post('/api/cohorts/preview').send({ criteria });
    // Primary follow-up: an assessment within weeks 10–16 (days 70–112) of the start (registry rule v1).
    const expected = data.episodes.filter(
      (e) =>
        e.consent &&
        e.baseline['nprs-first-step']! >= 6 &&
        e.baseline['nprs-first-step']! <= 9 &&
        e.followUps.some((v) => v.day >= 70 && v.day <= 112) &&
        e.interventions.includes('toe-flexor'),
    ).length;
    expect(expected).toBeGreaterThan(0);
    expect(res.body.count).toBe(expected);
    const nprs = res.body.summary.instruments.find((i: { code: string }) => i.code === 'nprs-first-step');
    expect(nprs.nPaired).toBe(expected);
  });

  it('summarises outcomes of the whole cohort and hides small cells from researchers', async () => {
    const all = await steward.post('/api/cohorts/preview').send({ criteria: mine() });
    const paired = data.episodes.filter(
      (e) => e.consent && e.followUps.some((v) => v.day >= 70 && v.day <= 112),
    ).length;
    const nprs = all.body.summary.instruments.find((i: { code: string }) => i.code === 'nprs-first-step');
    expect(nprs.nPaired).toBe(paired);
    expect(nprs.change.mean).toBeGreaterThan(0); // pain falls in the invented courses
    expect(all.body.summary.recovery.n).toBe(data.episodes.filter((e) => e.consent).length);

    // An age band holding one to four consenting episodes of ours: a small cell.
    const bandCounts = new Map<string, number>();
    for (const e of data.episodes)
      if (e.consent) bandCounts.set(ageBand(e.ageYears), (bandCounts.get(ageBand(e.ageYears)) ?? 0) + 1);
    const band = [...bandCounts].find(([, n]) => n >= 1 && n <= 4)?.[0];
    expect(band).toBeDefined();
    const tiny = mine({ ageBands: [band] });
    const exact = await steward.post('/api/cohorts/preview').send({ criteria: tiny });
    const shown = await researcher.post('/api/cohorts/preview').send({ criteria: tiny });
    expect(exact.body.suppressedBelow).toBeNull();
    expect(shown.body.suppressedBelow).toBe(5);
    expect(exact.body.count).toBe(bandCounts.get(band!));
    expect(shown.body.count).toBe('<5');
    for (const s of shown.body.attrition) {
      for (const v of [s.excluded, s.remaining]) if (typeof v === 'number') expect(v === 0 || v >= 5).toBe(true);
    }
    // No small cell can be worked out by subtracting shown counts (complementary suppression).
    const values = smallCellValues(shown.body.attrition, 5);
    expect(values.size).toBeGreaterThan(0);
    for (const [cell, options] of values) expect(options.size, cell).toBeGreaterThanOrEqual(2);
  });

  it('rejects unknown codes and malformed criteria with 422', async () => {
    expect(
      (await steward.post('/api/cohorts/preview').send({ criteria: mine({ completeInstrument: 'no-such' }) })).status,
    ).toBe(422);
    expect(
      (await steward.post('/api/cohorts/preview').send({ criteria: mine({ addOns: { codes: ['education-load'] } }) }))
        .status,
    ).toBe(422);
    expect(
      (
        await steward
          .post('/api/cohorts/preview')
          .send({ criteria: mine({ startFrom: '2024-05-01', startTo: '2024-01-01' }) })
      ).status,
    ).toBe(422);
    expect((await steward.post('/api/cohorts/preview').send({ criteria: mine({ clinicName: 'x' }) })).status).toBe(422);
  });
});

describe('saved cohorts', () => {
  it('saves, versions, duplicates and reports the change in count since saving', async () => {
    const created = await researcher
      .post('/api/cohorts')
      .send({ name: 'Runners', description: 'All runners', criteria: mine({ activityProfiles: ['runner'] }) });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    const runners = data.episodes.filter((e) => e.consent && e.activityProfile === 'runner').length;
    expect(created.body.currentVersion).toBe(1);
    expect(created.body.countAtSave).toBe(runners < 5 && runners > 0 ? '<5' : runners);

    const v2 = await researcher
      .put(`/api/cohorts/${id}`)
      .send({ name: 'Runners and active', criteria: mine({ activityProfiles: ['runner', 'active'] }) });
    expect(v2.status).toBe(200);
    expect(v2.body.currentVersion).toBe(2);
    expect(v2.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(v2.body.versions[1].criteria.activityProfiles).toEqual(['runner']);

    // New data after the save: the list shows today's count and the change.
    const before = (await researcher.get('/api/cohorts')).body.items.find((c: { id: number }) => c.id === id);
    expect(before.change).toBe(0);
    const more = randomSpecs(12, 1, 777).map((s) => ({ ...s, consent: true, activityProfile: 'runner' as const }));
    const extra = await seedDataset(ctx.db, ['Test Coast'], more);
    await ctx.db
      .update(episodes)
      .set({ conditionCode: data.condition })
      .where(eq(episodes.conditionCode, extra.condition));
    const after = (await researcher.get('/api/cohorts')).body.items.find((c: { id: number }) => c.id === id);
    expect(after.change).toBe(12);
    expect(after.countNow).toBe((before.countNow as number) + 12);

    const dup = await researcher.post(`/api/cohorts/${id}/duplicate`).send({});
    expect(dup.status).toBe(201);
    expect(dup.body.id).not.toBe(id);
    expect(dup.body.duplicatedFromId).toBe(id);
    expect(dup.body.currentVersion).toBe(1);
    expect(dup.body.criteria.activityProfiles).toEqual(['runner', 'active']);
  });

  it('keeps a researcher to their own cohorts; the steward sees them but cannot change them', async () => {
    const created = await researcher.post('/api/cohorts').send({ name: 'Private', criteria: mine() });
    const id = created.body.id as number;
    expect((await otherResearcher.get(`/api/cohorts/${id}`)).status).toBe(404);
    expect((await otherResearcher.put(`/api/cohorts/${id}`).send({ name: 'Mine now', criteria: mine() })).status).toBe(
      404,
    );
    expect((await otherResearcher.get('/api/cohorts')).body.items.some((c: { id: number }) => c.id === id)).toBe(false);
    expect((await steward.get(`/api/cohorts/${id}`)).status).toBe(200);
    expect((await steward.put(`/api/cohorts/${id}`).send({ name: 'Changed', criteria: mine() })).status).toBe(403);
    expect((await researcher.get('/api/cohorts/999999')).status).toBe(404);
    expect((await researcher.post('/api/cohorts').send({ name: '', criteria: mine() })).status).toBe(422);
  });
});

describe('clinic roles', () => {
  it('gets 403 on every cohort, data-request and export route', async () => {
    for (const role of ['clinician', 'lead'] as const) {
      const c = await signedInClient(ctx.app, (await createUser(ctx.db, role, data.clinics[0]!.id)).email);
      const calls: [string, ReturnType<Client['get']>][] = [
        ['list cohorts', c.get('/api/cohorts')],
        ['POST /api/cohorts', c.post('/api/cohorts').send({ name: 'x', criteria: {} })],
        ['POST /api/cohorts/preview', c.post('/api/cohorts/preview').send({ criteria: {} })],
        ['GET /api/cohorts/1', c.get('/api/cohorts/1')],
        ['PUT /api/cohorts/1', c.put('/api/cohorts/1').send({ name: 'x', criteria: {} })],
        ['POST /api/cohorts/1/duplicate', c.post('/api/cohorts/1/duplicate').send({})],
        ['GET /api/data-requests', c.get('/api/data-requests')],
        ['POST /api/data-requests', c.post('/api/data-requests').send({ cohortId: 1, purpose: 'x'.repeat(30) })],
        ['POST /api/data-requests/1/approve', c.post('/api/data-requests/1/approve').send({ expiresOn: '2099-01-01' })],
        ['POST /api/data-requests/1/decline', c.post('/api/data-requests/1/decline').send({ reason: 'no reason' })],
        ['GET /api/data-requests/1/export.csv', c.get('/api/data-requests/1/export.csv')],
        ['GET /api/data-requests/1/dictionary?format=md', c.get('/api/data-requests/1/dictionary?format=md')],
        ['GET /api/exports', c.get('/api/exports')],
      ];
      for (const [what, call] of calls) expect((await call).status, `${role}: ${what}`).toBe(403);
    }
  });
});
