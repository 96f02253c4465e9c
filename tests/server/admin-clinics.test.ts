import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { auditEvents, clinics } from '../../server/db/schema';
import { assertClinicAccepts } from '../../server/services/clinics.service';
import { testApp } from '../setup/test-app';
import { createClinic, createUser, signedInClient, type Client } from '../setup/auth';
import { auditCountBy, daysAgo, insertEpisode, unique } from './admin-fixtures';

const ctx = testApp();
afterAll(() => ctx.close());
let stewardId: number;
let steward: Client;

beforeAll(async () => {
  const s = await createUser(ctx.db, 'steward');
  stewardId = s.id;
  steward = await signedInClient(ctx.app, s.email);
});

describe('clinics in the console', () => {
  it('creates a clinic with its own pseudonym salt, audited once in the same transaction', async () => {
    const code = `N${unique().toUpperCase()}`;
    const before = await auditCountBy(ctx.db, stewardId, 'clinic');
    const res = await steward.post('/api/admin/clinics').send({ code, displayName: 'Seabright Physio', region: 'East' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ code, displayName: 'Seabright Physio', region: 'East', active: true, episodes: 0, completeness: null });
    expect(await auditCountBy(ctx.db, stewardId, 'clinic')).toBe(before + 1);
    const [row] = await ctx.db.select().from(clinics).where(eq(clinics.id, res.body.id));
    expect(row!.pseudonymSalt).toMatch(/^[0-9a-f]{32}$/);
    const [event] = await ctx.db.select().from(auditEvents).where(and(eq(auditEvents.entity, 'clinic'), eq(auditEvents.entityId, String(res.body.id))));
    expect(event).toMatchObject({ action: 'create', entity: 'clinic', clinicId: res.body.id, actorId: stewardId });
  });

  it('refuses a duplicate code (409), a bad code (422) and changes nothing', async () => {
    const c = await createClinic(ctx.db);
    const before = await auditCountBy(ctx.db, stewardId);
    const dup = await steward.post('/api/admin/clinics').send({ code: c.code, displayName: 'Again', region: 'East' });
    expect(dup.status).toBe(409);
    expect(dup.body.error.message).toContain(c.code);
    const bad = await steward.post('/api/admin/clinics').send({ code: 'x', displayName: '', region: 'East' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.issues.map((i: { path: string[] }) => i.path[0])).toEqual(expect.arrayContaining(['code', 'displayName']));
    expect(await auditCountBy(ctx.db, stewardId)).toBe(before);
  });

  it('renames and moves a clinic to another region: one audit row naming the changes; an unchanged patch writes none', async () => {
    const c = await createClinic(ctx.db);
    const before = await auditCountBy(ctx.db, stewardId, 'clinic');
    const res = await steward.patch(`/api/admin/clinics/${c.id}`).send({ displayName: 'Lantern Hill Clinic', region: 'West' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ displayName: 'Lantern Hill Clinic', region: 'West' });
    expect(await auditCountBy(ctx.db, stewardId, 'clinic')).toBe(before + 1);
    const [event] = await ctx.db.select().from(auditEvents).where(and(eq(auditEvents.entity, 'clinic'), eq(auditEvents.entityId, String(c.id))));
    expect(event!.detail).toEqual({ changes: { displayName: { from: c.displayName, to: 'Lantern Hill Clinic' }, region: { from: 'Test region', to: 'West' } } });
    expect((await steward.patch(`/api/admin/clinics/${c.id}`).send({ region: 'West' })).status).toBe(200);
    expect(await auditCountBy(ctx.db, stewardId, 'clinic')).toBe(before + 1);
    expect((await steward.patch('/api/admin/clinics/999999').send({ region: 'West' })).status).toBe(404);
    expect((await steward.patch(`/api/admin/clinics/${c.id}`).send({})).status).toBe(422);
  });

  it('deactivating keeps the data, refuses new submissions through the guard, and is audited', async () => {
    const c = await createClinic(ctx.db);
    const episodeId = await insertEpisode(ctx.db, c.id, daysAgo(30), [{ weeks: 0, timepoint: 'baseline', scores: { 'nprs-first-step': 7 } }]);
    await expect(assertClinicAccepts(ctx.db, c.id)).resolves.toBeUndefined();
    const before = await auditCountBy(ctx.db, stewardId, 'clinic');
    const res = await steward.post(`/api/admin/clinics/${c.id}/deactivate`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ active: false, episodes: 1 });
    expect(await auditCountBy(ctx.db, stewardId, 'clinic')).toBe(before + 1);
    await expect(assertClinicAccepts(ctx.db, c.id)).rejects.toMatchObject({ status: 403, message: expect.stringContaining(`Clinic ${c.code} is deactivated`) });
    expect((await steward.post(`/api/admin/clinics/${c.id}/deactivate`)).status).toBe(409);
    expect(await auditCountBy(ctx.db, stewardId, 'clinic')).toBe(before + 1);
    const detail = await steward.get(`/api/admin/clinics/${c.id}`);
    expect(detail.body.episodes).toBe(1);
    expect(episodeId).toBeGreaterThan(0);
    const back = await steward.post(`/api/admin/clinics/${c.id}/reactivate`);
    expect(back.body.active).toBe(true);
    await expect(assertClinicAccepts(ctx.db, c.id)).resolves.toBeUndefined();
  });

  it('reports users, episodes, follow-up completeness past the week-12 window, and the last submission', async () => {
    const c = await createClinic(ctx.db);
    await createUser(ctx.db, 'clinician', c.id);
    await createUser(ctx.db, 'lead', c.id);
    const base = { weeks: 0, timepoint: 'baseline' as const, scores: { 'nprs-first-step': 7 } };
    const w12 = { weeks: 12, timepoint: 'week12' as const, scores: { 'nprs-first-step': 2 } };
    // Default rules: the week-12 window closes on day 112. Two past it (one with a week-12 visit), one still inside.
    await insertEpisode(ctx.db, c.id, daysAgo(200), [base, w12]);
    await insertEpisode(ctx.db, c.id, daysAgo(150), [base]);
    await insertEpisode(ctx.db, c.id, daysAgo(60), [base]);
    const res = await steward.get(`/api/admin/clinics/${c.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ activeUsers: 2, episodes: 3, openEpisodes: 3, pastWeek12Window: 2, withWeek12: 1, completeness: 0.5 });
    expect(Date.now() - Date.parse(res.body.lastSubmissionAt)).toBeLessThan(60_000);
    const list = await steward.get('/api/admin/clinics');
    expect(list.body.items.find((x: { id: number }) => x.id === c.id)).toMatchObject({ completeness: 0.5 });
  });
  it('a deactivated clinic leaves the peer comparison from then on, and comes back when reactivated', async () => {
    const c = await createClinic(ctx.db, 'Peer exit clinic');
    for (let i = 0; i < 12; i++) {
      await insertEpisode(ctx.db, c.id, daysAgo(150 + i), [
        { weeks: 0, timepoint: 'baseline', scores: { 'nprs-first-step': 7 } },
        { weeks: 12, timepoint: 'week12', scores: { 'nprs-first-step': i % 3 } },
      ]);
    }
    const labels = async () => ((await steward.get('/api/analytics/clinics')).body.clinics as { label: string }[]).map((x) => x.label);
    expect(await labels()).toContain(c.code);
    await steward.post(`/api/admin/clinics/${c.id}/deactivate`);
    expect(await labels()).not.toContain(c.code);
    await steward.post(`/api/admin/clinics/${c.id}/reactivate`);
    expect(await labels()).toContain(c.code);
  });
});
