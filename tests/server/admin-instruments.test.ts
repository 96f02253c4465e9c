import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { auditEvents, instruments } from '../../server/db/schema';
import { testApp } from '../setup/test-app';
import { createClinic, createUser, signedInClient, type Client } from '../setup/auth';
import { auditCountBy, daysAgo, insertEpisode, unique } from './admin-fixtures';

const ctx = testApp();
afterAll(() => ctx.close());
let stewardId: number;
let steward: Client;
let clinicId: number;

beforeAll(async () => {
  const s = await createUser(ctx.db, 'steward');
  stewardId = s.id;
  steward = await signedInClient(ctx.app, s.email);
  clinicId = (await createClinic(ctx.db)).id;
});

/** A fresh instrument of this test file (0–50 points, lower is better). */
async function newInstrument(extra: Record<string, unknown> = {}) {
  const res = await steward.post('/api/admin/instruments').send({
    code: `adm-${unique()}`,
    label: 'Test heel score',
    unit: 'points',
    min: 0,
    max: 50,
    higherIsBetter: false,
    mcid: 5,
    mcidSource: 'Invented for a test',
    bodyRegion: 'foot',
    ...extra,
  });
  expect(res.status).toBe(201);
  return res.body as { id: number; code: string };
}

describe('instruments in the console', () => {
  it('lists the shipped instruments with their stored-score figures', async () => {
    const res = await steward.get('/api/admin/instruments');
    expect(res.status).toBe(200);
    const nprs = res.body.items.find((i: { code: string }) => i.code === 'nprs-first-step');
    expect(nprs).toMatchObject({ min: 0, max: 10, higherIsBetter: false, mcid: 2, retired: false });
    expect(nprs.mcidSource).toMatch(/Farrar 2001/);
  });

  it('creates, edits and changes the MCID with its source: one audit row per write', async () => {
    const before = await auditCountBy(ctx.db, stewardId, 'instrument');
    const inst = await newInstrument();
    expect(await auditCountBy(ctx.db, stewardId, 'instrument')).toBe(before + 1);
    const edit = await steward.patch(`/api/admin/instruments/${inst.id}`).send({ label: 'Heel score (renamed)', max: 60 });
    expect(edit.body).toMatchObject({ label: 'Heel score (renamed)', max: 60 });
    expect(await auditCountBy(ctx.db, stewardId, 'instrument')).toBe(before + 2);
    const noSource = await steward.put(`/api/admin/instruments/${inst.id}/mcid`).send({ mcid: 6 });
    expect(noSource.status).toBe(422);
    expect(noSource.body.error.issues[0].path).toEqual(['source']);
    const mcid = await steward.put(`/api/admin/instruments/${inst.id}/mcid`).send({ mcid: 6, source: 'Invented 2026 anchor study' });
    expect(mcid.body).toMatchObject({ mcid: 6, mcidSource: 'Invented 2026 anchor study' });
    expect(await auditCountBy(ctx.db, stewardId, 'instrument')).toBe(before + 3);
    const [ev] = await ctx.db.select().from(auditEvents).where(and(eq(auditEvents.action, 'update-mcid'), eq(auditEvents.entityId, String(inst.id))));
    expect(ev!.detail).toMatchObject({ changes: { mcid: { from: 5, to: 6 } } });
  });

  it('refuses to shrink the range below stored scores, naming the stored min and max, and changes nothing', async () => {
    const inst = await newInstrument();
    await insertEpisode(ctx.db, clinicId, daysAgo(100), [
      { weeks: 0, timepoint: 'baseline', scores: { [inst.code]: 42 } },
      { weeks: 6, timepoint: 'week6', scores: { [inst.code]: 3 } },
    ]);
    const before = await auditCountBy(ctx.db, stewardId, 'instrument');
    const shrinkTop = await steward.patch(`/api/admin/instruments/${inst.id}`).send({ max: 40 });
    expect(shrinkTop.status).toBe(422);
    expect(shrinkTop.body.error.message).toContain('stored min 3');
    expect(shrinkTop.body.error.message).toContain('stored max 42');
    const shrinkBottom = await steward.patch(`/api/admin/instruments/${inst.id}`).send({ min: 5 });
    expect(shrinkBottom.status).toBe(422);
    expect(shrinkBottom.body.error.issues[0].path).toEqual(['min']);
    const [row] = await ctx.db.select().from(instruments).where(eq(instruments.id, inst.id));
    expect(row).toMatchObject({ min: 0, max: 50 });
    expect(await auditCountBy(ctx.db, stewardId, 'instrument')).toBe(before);
    // Shrinking down to exactly the stored extremes is allowed.
    const exact = await steward.patch(`/api/admin/instruments/${inst.id}`).send({ min: 3, max: 42 });
    expect(exact.status).toBe(200);
    expect(exact.body).toMatchObject({ min: 3, max: 42, scoreCount: 2, storedMin: 3, storedMax: 42 });
    // Its direction cannot flip while scores are stored.
    expect((await steward.patch(`/api/admin/instruments/${inst.id}`).send({ higherIsBetter: true })).status).toBe(422);
  });

  it('an instrument in use cannot be deleted, only retired; an unused one can be deleted', async () => {
    const used = await newInstrument();
    await insertEpisode(ctx.db, clinicId, daysAgo(50), [{ weeks: 0, timepoint: 'baseline', scores: { [used.code]: 20 } }]);
    const del = await steward.delete(`/api/admin/instruments/${used.id}`);
    expect(del.status).toBe(409);
    expect(del.body.error.message).toMatch(/retire it instead/);
    const before = await auditCountBy(ctx.db, stewardId, 'instrument');
    const retire = await steward.post(`/api/admin/instruments/${used.id}/retire`);
    expect(retire.body).toMatchObject({ retired: true, scoreCount: 1 });
    expect(await auditCountBy(ctx.db, stewardId, 'instrument')).toBe(before + 1);
    expect((await steward.post(`/api/admin/instruments/${used.id}/retire`)).status).toBe(409);
    const unused = await newInstrument();
    expect((await steward.delete(`/api/admin/instruments/${unused.id}`)).status).toBe(204);
    expect(await ctx.db.select().from(instruments).where(eq(instruments.id, unused.id))).toEqual([]);
    expect(await auditCountBy(ctx.db, stewardId, 'instrument')).toBe(before + 3);
  });

  it('the recovery instrument of the current rules cannot be retired or deleted', async () => {
    const list = await steward.get('/api/admin/instruments');
    const nprs = list.body.items.find((i: { code: string }) => i.code === 'nprs-first-step');
    const retire = await steward.post(`/api/admin/instruments/${nprs.id}/retire`);
    expect(retire.status).toBe(422);
    expect(retire.body.error.message).toMatch(/recovery instrument/);
    expect((await steward.delete(`/api/admin/instruments/${nprs.id}`)).status).toBe(409);
  });
});
