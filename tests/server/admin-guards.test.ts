import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { assessments, episodes } from '../../server/db/schema';
import { testApp } from '../setup/test-app';
import { createClinic, createUser, signedInClient, type Client } from '../setup/auth';
import { daysAgo, unique } from './admin-fixtures';
import { csv, episodeRows } from './uploads-fixtures';

/** The console's settings reach the clinics' write path: retired instruments and deactivated clinics. */
const ctx = testApp();
afterAll(() => ctx.close());
let steward: Client;
let clinician: Client;
let clinic: { id: number; code: string };
let instrument: { id: number; code: string };

const newEpisode = (scores: Record<string, number>) => ({
  pseudonym: randomBytes(32).toString('hex'),
  reference: `GRD-${unique()}`,
  side: 'right',
  startDate: daysAgo(70),
  symptomWeeks: 20,
  ageYears: 51,
  sex: 'male',
  heightCm: 180,
  weightKg: 82,
  activityProfile: 'runner',
  standingWork: true,
  researchConsent: true,
  baseline: { assessedOn: daysAgo(70), scores },
});

const assessmentCount = async (episodeId: number) =>
  (await ctx.db.select({ n: sql<number>`count(*)::int` }).from(assessments).where(eq(assessments.episodeId, episodeId)))[0]!.n;

beforeAll(async () => {
  steward = await signedInClient(ctx.app, (await createUser(ctx.db, 'steward')).email);
  clinic = await createClinic(ctx.db, 'Guard clinic');
  clinician = await signedInClient(ctx.app, (await createUser(ctx.db, 'clinician', clinic.id)).email);
  const res = await steward.post('/api/admin/instruments').send({
    code: `grd-${unique()}`, label: 'Guard test score', unit: 'points', min: 0, max: 10,
    higherIsBetter: false, mcid: 2, mcidSource: 'Invented for a test', bodyRegion: 'foot',
  });
  instrument = res.body;
});

describe('console settings in the submission path', () => {
  it('a retired instrument takes no new scores: 422 naming it, nothing stored', async () => {
    const created = await clinician.post('/api/episodes').send(newEpisode({ 'nprs-first-step': 7, [instrument.code]: 6 }));
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    expect((await steward.post(`/api/admin/instruments/${instrument.id}/retire`)).status).toBe(200);
    const res = await clinician.post(`/api/episodes/${id}/assessments`).send({ assessedOn: daysAgo(28), timepoint: 'week6', scores: { [instrument.code]: 3 } });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toContain(`(${instrument.code}) is retired`);
    expect(await assessmentCount(id)).toBe(1);
    // The other instruments still take scores; reinstating lifts the refusal.
    expect((await clinician.post(`/api/episodes/${id}/assessments`).send({ assessedOn: daysAgo(28), timepoint: 'week6', scores: { 'nprs-first-step': 4 } })).status).toBe(201);
    await steward.post(`/api/admin/instruments/${instrument.id}/reinstate`);
    expect((await clinician.post(`/api/episodes/${id}/assessments`).send({ assessedOn: daysAgo(27), timepoint: 'interim', scores: { [instrument.code]: 3 } })).status).toBe(201);
  });

  it('a deactivated clinic keeps its episodes but accepts no new episode, assessment or upload (403 naming the clinic)', async () => {
    const created = await clinician.post('/api/episodes').send(newEpisode({ 'nprs-first-step': 8 }));
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    expect((await steward.post(`/api/admin/clinics/${clinic.id}/deactivate`)).status).toBe(200);
    const again = await clinician.post('/api/episodes').send(newEpisode({ 'nprs-first-step': 8 }));
    expect(again.status).toBe(403);
    expect(again.body.error.message).toContain(`Clinic ${clinic.code} is deactivated`);
    const visit = await clinician.post(`/api/episodes/${id}/assessments`).send({ assessedOn: daysAgo(28), timepoint: 'week6', scores: { 'nprs-first-step': 4 } });
    expect(visit.status).toBe(403);
    expect(await assessmentCount(id)).toBe(1);
    const file = Buffer.from(csv(episodeRows(`UPL-${unique()}`)), 'utf8');
    // The commit is the submission; a dry run only checks the file and writes nothing.
    const upload = await clinician.post('/api/uploads/episodes?dryRun=false').attach('file', file, 'clinic-export.csv');
    expect(upload.status).toBe(403);
    expect(upload.body.error.message).toContain('deactivated');
    const kept = await ctx.db.select().from(episodes).where(eq(episodes.clinicId, clinic.id));
    expect(kept).toHaveLength(2);
    expect((await clinician.get(`/api/episodes/${id}`)).status).toBe(200);
  });
});
