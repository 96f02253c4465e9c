import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { createApp } from '../../server/app';
import { assessments, auditEvents, scores, selfReportLinks } from '../../server/db/schema';
import { SELF_REPORT_RATE_LIMIT } from '../../server/routes/self-report.routes';
import { counts, daysAgo, makeClinic, makeEpisode, today } from './follow-ups-fixtures';

const ctx = testApp();
afterAll(() => ctx.close());

let clinician: Client;
let researcher: Client;
let episodeId: number;
let otherEpisodeId: number;
let episodePseudonym: string;
let clinicName: string;

beforeAll(async () => {
  const clinic = await makeClinic(ctx.db, 'Self-report clinic');
  clinicName = clinic.displayName;
  const other = await makeClinic(ctx.db, 'Elsewhere clinic');
  const episode = await makeEpisode(ctx.db, clinic.id, { startDate: daysAgo(75), reference: 'SR-0001' });
  episodeId = episode.id;
  episodePseudonym = episode.pseudonym;
  otherEpisodeId = (await makeEpisode(ctx.db, other.id, { startDate: daysAgo(75) })).id;
  clinician = await signedInClient(ctx.app, (await createUser(ctx.db, 'clinician', clinic.id)).email);
  researcher = await signedInClient(ctx.app, (await createUser(ctx.db, 'researcher')).email);
});

const tokenOf = (url: string) => new URL(url).pathname.split('/').at(-1)!;
async function newLink(timepoint = 'week12') {
  const res = await clinician.post(`/api/episodes/${episodeId}/self-report-links`).send({ timepoint });
  expect(res.status).toBe(201);
  return { ...(res.body as { url: string; expiresAt: string }), token: tokenOf(res.body.url) };
}
const anonymous = () => request(ctx.app);
const answers = { scores: { 'nprs-first-step': 3, 'faam-adl': 71.5, groc: 4 }, avgDailySteps: 6400 };

describe('POST /api/episodes/:id/self-report-links', () => {
  it('returns a link with a 43-character token valid for 14 days, and stores only its SHA-256', async () => {
    const link = await newLink();
    expect(link.url).toMatch(/\/report\/[A-Za-z0-9_-]{43}$/);
    const days = (new Date(link.expiresAt).getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(13.99);
    expect(days).toBeLessThanOrEqual(14);
    const [row] = await ctx.db
      .select()
      .from(selfReportLinks)
      .where(eq(selfReportLinks.tokenHash, createHash('sha256').update(link.token).digest('hex')));
    expect(row).toMatchObject({ episodeId, timepoint: 'week12', usedAt: null });
    const leaked = await ctx.db.execute(
      sql`select 1 from self_report_link l, audit_event a where l::text like ${`%${link.token}%`} or a::text like ${`%${link.token}%`}`,
    );
    expect(leaked.rows).toHaveLength(0);
  });

  it('shows the waiting link on the due list', async () => {
    const link = await newLink('week12');
    const list = await clinician.get('/api/follow-ups');
    const item = list.body.items.find((i: { episodeId: number }) => i.episodeId === episodeId);
    expect(item).toMatchObject({ timepoint: 'week12', state: 'due' });
    expect(new Date(item.linkExpiresAt).getTime()).toBeGreaterThanOrEqual(new Date(link.expiresAt).getTime() - 1000);
  });

  it("answers 404 for another clinic's episode or an unknown one, 422 for a bad timepoint, 403 for a researcher", async () => {
    const before = await counts(ctx.db);
    expect(
      (await clinician.post(`/api/episodes/${otherEpisodeId}/self-report-links`).send({ timepoint: 'week12' })).status,
    ).toBe(404);
    expect(
      (await clinician.post('/api/episodes/999999999/self-report-links').send({ timepoint: 'week12' })).status,
    ).toBe(404);
    expect(
      (await clinician.post(`/api/episodes/${episodeId}/self-report-links`).send({ timepoint: 'baseline' })).status,
    ).toBe(422);
    expect((await clinician.post(`/api/episodes/${episodeId}/self-report-links`).send({})).status).toBe(422);
    expect(
      (await researcher.post(`/api/episodes/${episodeId}/self-report-links`).send({ timepoint: 'week12' })).status,
    ).toBe(403);
    expect(
      (await clinician.agent.post(`/api/episodes/${episodeId}/self-report-links`).send({ timepoint: 'week12' })).status,
    ).toBe(403);
    expect(await counts(ctx.db)).toEqual(before);
  });
});

describe('the public self-report pair', () => {
  it('tells the page only the clinic name, the timepoint and the questions with their ranges', async () => {
    const { token } = await newLink();
    const res = await anonymous().get(`/api/self-report/${token}`);
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(Object.keys(res.body).sort()).toEqual(['clinicName', 'questions', 'timepoint']);
    expect(res.body.clinicName).toBe(clinicName);
    expect(res.body.questions).toEqual([
      { code: 'nprs-first-step', label: expect.any(String), min: 0, max: 10, step: 1, input: 'rating' },
      { code: 'faam-adl', label: expect.any(String), min: 0, max: 100, step: 0.1, input: 'number' },
      { code: 'groc', label: expect.any(String), min: -7, max: 7, step: 1, input: 'rating' },
    ]);
    expect(res.text).not.toContain('SR-0001');
    expect(res.text).not.toContain(episodePseudonym);
  });

  it('stores one patient-reported assessment without a session or CSRF token, audited with no actor', async () => {
    const { token } = await newLink();
    const res = await anonymous().post(`/api/self-report/${token}`).send(answers);
    expect(res.status).toBe(201);
    const [link] = await ctx.db
      .select()
      .from(selfReportLinks)
      .where(eq(selfReportLinks.tokenHash, createHash('sha256').update(token).digest('hex')));
    expect(link!.usedAt).not.toBeNull();
    const [a] = await ctx.db.select().from(assessments).where(eq(assessments.id, link!.assessmentId!));
    expect(a).toMatchObject({
      episodeId,
      timepoint: 'week12',
      reporter: 'patient',
      assessedOn: today(),
      avgDailySteps: 6400,
      createdBy: null,
    });
    const stored = await ctx.db.select({ value: scores.value }).from(scores).where(eq(scores.assessmentId, a!.id));
    expect(stored.map((s) => s.value).sort((x, y) => x - y)).toEqual([3, 4, 71.5]);
    const [event] = await ctx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'assessment'), eq(auditEvents.entityId, String(a!.id))));
    expect(event).toMatchObject({ actorId: null, action: 'create', entity: 'assessment' });
    expect(event!.detail).toMatchObject({ via: 'self-report' });

    // The week-12 follow-up is done now, so it leaves the due list.
    const list = await clinician.get('/api/follow-ups');
    expect(list.body.items.some((i: { episodeId: number }) => i.episodeId === episodeId)).toBe(false);

    // A second use is refused and writes nothing.
    const before = await counts(ctx.db);
    const again = await anonymous()
      .post(`/api/self-report/${token}`)
      .send({ scores: { 'nprs-first-step': 2 } });
    expect(again.status).toBe(410);
    expect(again.body.error.message).toMatch(/already been used/);
    expect((await anonymous().get(`/api/self-report/${token}`)).status).toBe(410);
    expect(await counts(ctx.db)).toEqual(before);
  });

  it('refuses an expired link with 410 and writes nothing', async () => {
    const { token } = await newLink('week6');
    await ctx.db
      .update(selfReportLinks)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(selfReportLinks.tokenHash, createHash('sha256').update(token).digest('hex')));
    const before = await counts(ctx.db);
    expect((await anonymous().get(`/api/self-report/${token}`)).status).toBe(410);
    const res = await anonymous().post(`/api/self-report/${token}`).send(answers);
    expect(res.status).toBe(410);
    expect(res.body.error.message).toMatch(/expired/);
    expect(await counts(ctx.db)).toEqual(before);
  });

  it('refuses a tampered, truncated or made-up token with 404 and writes nothing', async () => {
    const { token } = await newLink('week26');
    const flipped = `${token.slice(0, 10)}${token[10] === 'A' ? 'B' : 'A'}${token.slice(11)}`;
    const before = await counts(ctx.db);
    for (const t of [flipped, token.slice(0, 42), `${token}x`, 'not-a-token']) {
      expect((await anonymous().get(`/api/self-report/${t}`)).status).toBe(404);
      expect((await anonymous().post(`/api/self-report/${t}`).send(answers)).status).toBe(404);
    }
    expect(await counts(ctx.db)).toEqual(before);
    // The real token still works afterwards.
    expect((await anonymous().get(`/api/self-report/${token}`)).status).toBe(200);
  });

  it('refuses answers out of range, off the scale or not on the form with 422, keeping the link usable', async () => {
    const { token } = await newLink('week26');
    const before = await counts(ctx.db);
    for (const body of [
      { scores: { 'nprs-first-step': 11 } },
      { scores: { 'nprs-first-step': 3.5 } },
      { scores: { groc: -8 } },
      { scores: { 'faam-adl': 71.55 } },
      { scores: { lefs: 40 } },
      { scores: {} },
      { scores: { 'nprs-first-step': 3 }, reference: 'SR-0001' },
      { scores: { 'nprs-first-step': 3 }, avgDailySteps: -5 },
    ]) {
      const res = await anonymous().post(`/api/self-report/${token}`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(422);
    }
    expect(await counts(ctx.db)).toEqual(before);
    expect(
      (
        await anonymous()
          .post(`/api/self-report/${token}`)
          .send({ scores: { 'nprs-first-step': 4 } })
      ).status,
    ).toBe(201);
  });

  it('exempts exactly POST /api/self-report/:token from CSRF, nothing beside it', async () => {
    const res = await anonymous().post('/api/self-report/abc/extra').send(answers);
    expect(res.status).toBe(403);
  });

  it('limits the requests one address can make, per app', async () => {
    const app = createApp({ pool: ctx.pool, db: ctx.db, log: () => undefined });
    const agent = request(app);
    for (let i = 0; i < SELF_REPORT_RATE_LIMIT; i++)
      expect((await agent.get('/api/self-report/not-a-token')).status).toBe(404);
    const before = await counts(ctx.db);
    const limited = await agent.post('/api/self-report/not-a-token').send(answers);
    expect(limited.status).toBe(429);
    expect(limited.body.error.message).toMatch(/Too many/);
    expect(await counts(ctx.db)).toEqual(before);
    // The shared test app keeps its own counter.
    expect((await anonymous().get('/api/self-report/not-a-token')).status).toBe(404);
  });
});
