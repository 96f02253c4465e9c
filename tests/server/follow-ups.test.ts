import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { auditEvents, users } from '../../server/db/schema';
import { daysAgo, makeClinic, makeEpisode } from './follow-ups-fixtures';

const ctx = testApp();
afterAll(() => ctx.close());

let clinician: Client;
let otherClinician: Client;
let researcher: Client;
let clinicianId: number;
const ids: Record<string, number> = {};

beforeAll(async () => {
  const a = await makeClinic(ctx.db, 'Follow-up clinic A');
  const b = await makeClinic(ctx.db, 'Follow-up clinic B');
  ids.due = (await makeEpisode(ctx.db, a.id, { startDate: daysAgo(40), reference: 'FU-DUE' })).id; // week 6, day 40 of 35–56
  ids.closing = (await makeEpisode(ctx.db, a.id, { startDate: daysAgo(108), reference: 'FU-CLOSING' })).id; // week 12, day 108 of 70–112
  ids.done = (
    await makeEpisode(ctx.db, a.id, {
      startDate: daysAgo(80),
      reference: 'FU-DONE',
      assessments: [
        { timepoint: 'baseline', assessedOn: daysAgo(80), scores: { 'nprs-first-step': 6 } },
        { timepoint: 'week12', assessedOn: daysAgo(5), scores: { 'nprs-first-step': 3 } },
      ],
    })
  ).id;
  await makeEpisode(ctx.db, a.id, {
    startDate: daysAgo(40),
    status: 'discharged',
    dischargeDate: daysAgo(2),
    dischargeReason: 'recovered',
  });
  ids.otherClinic = (await makeEpisode(ctx.db, b.id, { startDate: daysAgo(40), reference: 'FU-ELSEWHERE' })).id;
  const c = await createUser(ctx.db, 'clinician', a.id);
  clinicianId = c.id;
  clinician = await signedInClient(ctx.app, c.email);
  otherClinician = await signedInClient(ctx.app, (await createUser(ctx.db, 'clinician', b.id)).email);
  researcher = await signedInClient(ctx.app, (await createUser(ctx.db, 'researcher')).email);
});

describe('GET /api/follow-ups', () => {
  it("lists the clinic's due and closing follow-ups of open episodes, soonest closing first", async () => {
    const res = await clinician.get('/api/follow-ups');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    expect(
      res.body.items.map((i: { reference: string; timepoint: string; state: string; daysLeft: number }) => [
        i.reference,
        i.timepoint,
        i.state,
        i.daysLeft,
      ]),
    ).toEqual([
      ['FU-CLOSING', 'week12', 'closing', 4],
      ['FU-DUE', 'week6', 'due', 16],
    ]);
    expect(res.body.items[1]).toMatchObject({
      episodeId: ids.due,
      opensOn: daysAgo(5),
      closesOn: daysAgo(-16),
      linkExpiresAt: null,
    });
  });

  it('filters by state and sorts on request (ties by closing date)', async () => {
    const res = await clinician.get('/api/follow-ups?state=missed,done&sort=reference&order=desc');
    expect(res.status).toBe(200);
    expect(
      res.body.items.map(
        (i: { reference: string; timepoint: string; state: string }) => `${i.reference} ${i.timepoint} ${i.state}`,
      ),
    ).toEqual(['FU-DONE week6 missed', 'FU-DONE week12 done', 'FU-CLOSING week6 missed']);
  });

  it("never shows another clinic's episodes", async () => {
    const mine = await clinician.get('/api/follow-ups?state=upcoming,due,closing,missed,done');
    expect(mine.body.items.some((i: { episodeId: number }) => i.episodeId === ids.otherClinic)).toBe(false);
    const theirs = await otherClinician.get('/api/follow-ups');
    expect(theirs.body.items.map((i: { reference: string }) => i.reference)).toEqual(['FU-ELSEWHERE']);
  });

  it('refuses an unknown state with 422, a signed-out caller with 401 and a researcher with 403', async () => {
    const bad = await clinician.get('/api/follow-ups?state=late');
    expect(bad.status).toBe(422);
    expect(bad.body.error.issues.length).toBeGreaterThan(0);
    expect((await request(ctx.app).get('/api/follow-ups')).status).toBe(401);
    expect((await researcher.get('/api/follow-ups')).status).toBe(403);
  });

  it('keeps the lead-only views from clinicians', async () => {
    expect((await clinician.get('/api/follow-ups/completeness')).status).toBe(403);
    expect((await clinician.get('/api/follow-ups/lost-proposals')).status).toBe(403);
  });
});

describe('PATCH /api/me/preferences', () => {
  it('turns the digest off and on again for the caller only, audited', async () => {
    expect((await clinician.get('/api/me/preferences')).body).toEqual({ digestOptOut: false });
    const off = await clinician.patch('/api/me/preferences').send({ digestOptOut: true });
    expect(off.status).toBe(200);
    expect(off.body).toEqual({ digestOptOut: true });
    const [row] = await ctx.db.select({ v: users.digestOptOut }).from(users).where(eq(users.id, clinicianId));
    expect(row!.v).toBe(true);
    const events = await ctx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'user-preferences'), eq(auditEvents.actorId, clinicianId)));
    expect(events).toHaveLength(1);
    expect((await clinician.patch('/api/me/preferences').send({ digestOptOut: false })).body).toEqual({
      digestOptOut: false,
    });
  });

  it('refuses a bad body with 422 and a request without the CSRF header with 403, changing nothing', async () => {
    expect((await clinician.patch('/api/me/preferences').send({ digestOptOut: 'yes' })).status).toBe(422);
    expect((await clinician.patch('/api/me/preferences').send({ digestOptOut: true, role: 'steward' })).status).toBe(
      422,
    );
    expect((await clinician.agent.patch('/api/me/preferences').send({ digestOptOut: true })).status).toBe(403);
    expect((await clinician.get('/api/me/preferences')).body).toEqual({ digestOptOut: false });
  });
});
