import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { auditEvents } from '../../server/db/schema';
import { neutraliseCell } from '../../server/services/admin/audit-csv';
import { testApp } from '../setup/test-app';
import { createClinic, createUser, signedInClient, type Client } from '../setup/auth';
import { auditCountBy, unique } from './admin-fixtures';

const ctx = testApp();
afterAll(() => ctx.close());
let stewardId: number;
let steward: Client;
let clinicA: number;
let clinicB: number;
let lead: Client;
const tag = unique();

beforeAll(async () => {
  const s = await createUser(ctx.db, 'steward');
  stewardId = s.id;
  steward = await signedInClient(ctx.app, s.email);
  clinicA = (await createClinic(ctx.db, 'Audit clinic A')).id;
  clinicB = (await createClinic(ctx.db, 'Audit clinic B')).id;
  lead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', clinicA)).email);
  // Invented events with a tag of this file, one of them with a formula-like value.
  await ctx.db.insert(auditEvents).values([
    { actorId: stewardId, clinicId: clinicA, action: `t-${tag}`, entity: 'episode', entityId: '1', at: new Date('2026-03-01T10:00:00Z'), detail: { note: 'a' } },
    { actorId: stewardId, clinicId: clinicA, action: `t-${tag}`, entity: 'assessment', entityId: '2', at: new Date('2026-03-02T10:00:00Z') },
    { actorId: stewardId, clinicId: clinicB, action: `t-${tag}`, entity: 'episode', entityId: '=HYPERLINK("x")', at: new Date('2026-03-03T23:59:00Z') },
    { actorId: stewardId, clinicId: null, action: `t-${tag}`, entity: 'registry-rules', entityId: '9', at: new Date('2026-03-05T08:00:00Z') },
  ]);
});

describe('the audit trail', () => {
  it('filters by action, entity and inclusive date range, newest first, with paging', async () => {
    const all = await steward.get(`/api/audit?action=t-${tag}`);
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(4);
    expect(all.body.items.map((e: { at: string }) => e.at)).toEqual([
      '2026-03-05T08:00:00.000Z', '2026-03-03T23:59:00.000Z', '2026-03-02T10:00:00.000Z', '2026-03-01T10:00:00.000Z',
    ]);
    expect(all.body.items[0]).toMatchObject({ actorId: stewardId, actorName: 'Test steward', entity: 'registry-rules' });
    const episodesOnly = await steward.get(`/api/audit?action=t-${tag}&entity=episode`);
    expect(episodesOnly.body.total).toBe(2);
    const days = await steward.get(`/api/audit?action=t-${tag}&from=2026-03-02&to=2026-03-03`);
    expect(days.body.total).toBe(2);
    const page = await steward.get(`/api/audit?action=t-${tag}&limit=3&offset=3`);
    expect(page.body.items).toHaveLength(1);
    expect((await steward.get('/api/audit?from=2026-03-05&to=2026-03-01')).status).toBe(422);
    const facets = await steward.get('/api/audit/facets');
    expect(facets.body.actions).toContain(`t-${tag}`);
  });

  it('filters by actor name or e-mail', async () => {
    const other = await createUser(ctx.db, 'steward', null, `someone-${tag}@test.loadline.test`);
    await ctx.db.insert(auditEvents).values({ actorId: other.id, clinicId: null, action: `t-${tag}`, entity: 'clinic' });
    const res = await steward.get(`/api/audit?action=t-${tag}&actor=someone-${tag}`);
    expect(res.body.total).toBe(1);
    expect(res.body.items[0].actorEmail).toBe(other.email);
    // LIKE wildcards in the filter are taken literally.
    expect((await steward.get(`/api/audit?action=t-${tag}&actor=%25`)).body.total).toBe(0);
  });

  it("a lead sees only their clinic's events", async () => {
    const res = await lead.get(`/api/audit?action=t-${tag}`);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    expect(res.body.items.every((e: { clinicId: number }) => e.clinicId === clinicA)).toBe(true);
    const csv = await lead.get(`/api/audit/export.csv?action=t-${tag}`);
    expect(parse(csv.text)).toHaveLength(3);
  });

  it('downloads the filtered view as CSV with formula-like cells neutralised, and audits the download', async () => {
    const before = await auditCountBy(ctx.db, stewardId, 'audit-trail');
    const res = await steward.get(`/api/audit/export.csv?action=t-${tag}&entity=episode`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="loadline-audit-/);
    const rows = parse(res.text) as string[][];
    expect(rows[0]).toEqual(['id', 'when', 'actor', 'actor_email', 'clinic', 'action', 'entity', 'entity_id', 'detail']);
    expect(rows).toHaveLength(3);
    expect(rows[2]![7]).toBe(`'=HYPERLINK("x")`);
    expect(rows[1]![8]).toBe('{"note":"a"}');
    expect(await auditCountBy(ctx.db, stewardId, 'audit-trail')).toBe(before + 1);
  });

  it('neutralises every formula trigger and leaves ordinary text alone', () => {
    for (const s of ['=1+1', '+1', '-1', '@SUM(A1)', '\tx', '\rx']) expect(neutraliseCell(s)).toBe(`'${s}`);
    expect(neutraliseCell('plain')).toBe('plain');
    expect(neutraliseCell(null)).toBe('');
    expect(neutraliseCell(12)).toBe('12');
  });
});
