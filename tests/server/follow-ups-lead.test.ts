import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { daysAgo, makeClinic, makeEpisode } from './follow-ups-fixtures';

const ctx = testApp();
afterAll(() => ctx.close());

type Share = { expected: number; completed: number; share: number | null };
type Row = { timepoint: string; clinic: Share; registry: Share };

describe('GET /api/follow-ups/completeness (lead)', () => {
  let lead: Client;
  let before: Row[];
  beforeAll(async () => {
    const clinic = await makeClinic(ctx.db, 'Completeness clinic');
    lead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', clinic.id)).email);
    before = (await lead.get('/api/follow-ups/completeness')).body.timepoints;
    const start = daysAgo(100); // week 6 (days 35–56) closed 44 days ago; week 12 closes in 12 days
    const base = { timepoint: 'baseline' as const, assessedOn: start, scores: { 'nprs-first-step': 6 } };
    // Expected and completed (a week-6 assessment on day 40):
    await makeEpisode(ctx.db, clinic.id, {
      startDate: start,
      assessments: [base, { timepoint: 'week6', assessedOn: daysAgo(60) }],
    });
    // Expected and completed by a discharge assessment inside the window (day 50):
    await makeEpisode(ctx.db, clinic.id, {
      startDate: start,
      status: 'discharged',
      dischargeDate: daysAgo(50),
      dischargeReason: 'recovered',
      assessments: [base, { timepoint: 'discharge', assessedOn: daysAgo(50) }],
    });
    // Expected, not completed:
    await makeEpisode(ctx.db, clinic.id, { startDate: start });
    // Lost touch before the window opened: still expected, not completed.
    await makeEpisode(ctx.db, clinic.id, {
      startDate: start,
      status: 'lost',
      dischargeDate: daysAgo(80),
      dischargeReason: 'lost-to-follow-up',
    });
    // Discharged as recovered on day 20, before the window opened: not expected.
    await makeEpisode(ctx.db, clinic.id, {
      startDate: start,
      status: 'discharged',
      dischargeDate: daysAgo(80),
      dischargeReason: 'recovered',
    });
    // Started 500 days ago: only its week-26 window (closed 290 days ago) falls in the last 12 months.
    await makeEpisode(ctx.db, clinic.id, { startDate: daysAgo(500) });
  });

  it("gives the clinic's share of expected follow-ups completed, per timepoint, against the 80% target", async () => {
    const res = await lead.get('/api/follow-ups/completeness');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ from: daysAgo(365), to: daysAgo(1), target: 0.8 });
    const byTp = Object.fromEntries((res.body.timepoints as Row[]).map((r) => [r.timepoint, r.clinic]));
    expect(byTp.week6).toEqual({ expected: 4, completed: 2, share: 0.5 });
    expect(byTp.week12).toEqual({ expected: 0, completed: 0, share: null });
    expect(byTp.week26).toEqual({ expected: 1, completed: 0, share: 0 });
  });

  it('counts the same follow-ups in the registry figure (which spans every clinic)', async () => {
    const after = (await lead.get('/api/follow-ups/completeness')).body.timepoints as Row[];
    const delta = after.map((r, i) => [
      r.timepoint,
      r.registry.expected - before[i]!.registry.expected,
      r.registry.completed - before[i]!.registry.completed,
    ]);
    expect(delta).toEqual([
      ['week6', 4, 2],
      ['week12', 0, 0],
      ['week26', 1, 0],
    ]);
  });
});

describe('GET /api/follow-ups/lost-proposals (lead)', () => {
  let lead: Client;
  beforeAll(async () => {
    const clinic = await makeClinic(ctx.db, 'Lost-proposal clinic');
    lead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', clinic.id)).email);
    await makeEpisode(ctx.db, clinic.id, { startDate: daysAgo(200), reference: 'LP-200' });
    await makeEpisode(ctx.db, clinic.id, { startDate: daysAgo(182), reference: 'LP-182' });
    await makeEpisode(ctx.db, clinic.id, { startDate: daysAgo(181), reference: 'LP-181' });
    await makeEpisode(ctx.db, clinic.id, {
      startDate: daysAgo(300),
      reference: 'LP-RECENT',
      assessments: [
        { timepoint: 'baseline', assessedOn: daysAgo(300) },
        { timepoint: 'week26', assessedOn: daysAgo(120) },
      ],
    });
    await makeEpisode(ctx.db, clinic.id, { startDate: daysAgo(400), reference: 'LP-ALREADY', status: 'lost' });
  });

  it('proposes open episodes with no assessment for 26 weeks (182 days), longest first, with their version', async () => {
    const res = await lead.get('/api/follow-ups/lost-proposals');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    expect(
      res.body.items.map((i: { reference: string; daysWithoutAssessment: number }) => [
        i.reference,
        i.daysWithoutAssessment,
      ]),
    ).toEqual([
      ['LP-200', 200],
      ['LP-182', 182],
    ]);
    expect(res.body.items[0]).toMatchObject({ lastAssessedOn: daysAgo(200), version: 1 });
  });

  it("changes nothing by itself: the lead's PATCH with the proposal's version marks it lost, a stale version is refused", async () => {
    const [first] = (await lead.get('/api/follow-ups/lost-proposals')).body.items as {
      episodeId: number;
      version: number;
    }[];
    const stale = await lead
      .patch(`/api/episodes/${first!.episodeId}`)
      .send({ status: 'lost', version: first!.version + 1 });
    expect(stale.status).toBe(409);
    expect((await lead.get('/api/follow-ups/lost-proposals')).body.total).toBe(2);
    const ok = await lead.patch(`/api/episodes/${first!.episodeId}`).send({ status: 'lost', version: first!.version });
    expect(ok.status).toBe(200);
    const after = await lead.get('/api/follow-ups/lost-proposals');
    expect(after.body.items.map((i: { reference: string }) => i.reference)).toEqual(['LP-182']);
  });
});
