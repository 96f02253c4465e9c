import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, desc, eq } from 'drizzle-orm';
import { parse } from 'csv-parse/sync';
import { auditEvents, episodes } from '../../server/db/schema';
import { UploadListSchema, UploadResultSchema } from '../../shared/schemas/upload';
import { UPLOAD_COLUMNS } from '../../shared/upload-columns';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { createClinic, snapshot } from './episodes-fixtures';
import { csv, episodeRows } from './uploads-fixtures';

const ctx = testApp();
let clinicId: number;
let lead: Client;
let otherLead: Client;
afterAll(() => ctx.close());
beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'UPC')).id;
  lead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', clinicId)).email);
  otherLead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', (await createClinic(ctx.db, 'UPO')).id)).email);
});

const send = (c: Client, text: string, dryRun: '0' | '1') =>
  c.post(`/api/uploads/episodes?dryRun=${dryRun}`).attach('file', Buffer.from(text, 'utf8'), 'clinic-export.csv');
const uploadAudits = () =>
  ctx.db.select().from(auditEvents).where(and(eq(auditEvents.clinicId, clinicId), eq(auditEvents.action, 'upload'))).orderBy(desc(auditEvents.id));

describe('CSV upload: dry run, commit, re-upload, correction', () => {
  const file = csv([...episodeRows('UC-1', 2), ...episodeRows('UC-2', 1), ...episodeRows('UC-3', 0)]);

  it('a dry run says what would change and writes nothing at all', async () => {
    const before = await snapshot(ctx.db);
    const res = await send(lead, file, '1');
    expect(res.status).toBe(200);
    expect(UploadResultSchema.parse(res.body)).toEqual({
      dryRun: true,
      accepted: 6,
      rejected: 0,
      errors: [],
      truncated: false,
      changes: { episodesCreated: 3, episodesUpdated: 0, assessmentsCreated: 6, assessmentsUpdated: 0, rowsUnchanged: 0 },
      uploadId: null,
    });
    expect(await snapshot(ctx.db)).toEqual(before);
  });

  it('a commit writes episodes, assessments, scores and interventions, one upload record and one audit event', async () => {
    const res = await send(lead, file, '0');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ dryRun: false, accepted: 6, changes: { episodesCreated: 3, assessmentsCreated: 6 }, uploadId: expect.any(Number) });
    const [stored] = await ctx.db.select().from(episodes).where(and(eq(episodes.clinicId, clinicId), eq(episodes.reference, 'UC-1')));
    const detail = (await lead.get(`/api/episodes/${stored!.id}`)).body;
    expect(detail).toMatchObject({ status: 'open', weightKg: 82.5, bmiBand: 'overweight', version: 1 });
    expect(detail.assessments.map((a: { timepoint: string; scores: Record<string, number> }) => [a.timepoint, a.scores['nprs-first-step'], a.scores.groc])).toEqual([
      ['baseline', 7, undefined],
      ['week6', 5, 2],
      ['week12', 2, -1],
    ]);
    expect(detail.interventions.map((i: { code: string; maxLevel: number | null }) => `${i.code}:${i.maxLevel}`)).toEqual([
      'education-load:null',
      'fascia-stretch:null',
      'heel-raises:2',
    ]);
    const [audit] = await uploadAudits();
    expect(audit).toMatchObject({ entity: 'upload', entityId: String(res.body.uploadId) });
    expect(audit!.detail).toMatchObject({ rows: 6, episodesCreated: 3, assessmentsCreated: 6, createdEpisodes: ['UC-1', 'UC-2', 'UC-3'], fileName: 'clinic-export.csv' });
    const list = UploadListSchema.parse((await lead.get('/api/uploads')).body);
    expect(list.items[0]).toMatchObject({ id: res.body.uploadId, clinicId, rowCount: 6, status: 'committed' });
    expect((await otherLead.get('/api/uploads')).body.items.some((u: { id: number }) => u.id === res.body.uploadId)).toBe(false);
  });

  it('re-uploading the same file changes no episode data (only the upload and its audit event are recorded)', async () => {
    const before = await snapshot(ctx.db);
    const res = await send(lead, file, '0');
    expect(res.status).toBe(200);
    expect(res.body.changes).toEqual({ episodesCreated: 0, episodesUpdated: 0, assessmentsCreated: 0, assessmentsUpdated: 0, rowsUnchanged: 6 });
    const after = await snapshot(ctx.db);
    for (const t of ['episode', 'assessment', 'score', 'episode_intervention']) expect(after[t], t).toBe(before[t]);
    expect((await uploadAudits())[0]!.detail).toMatchObject({ episodesUpdated: 0, changedEpisodes: [] });
  });

  it('a corrected file updates in place, bumps the version, and the audit says what changed', async () => {
    const rows = [...episodeRows('UC-1', 2, { weight_kg: '80', interventions: 'education-load;heel-raises:3' }), ...episodeRows('UC-2', 1)];
    rows[2]!.score_nprs_first_step = '3';
    rows[4]!.score_groc = '';
    const before = await snapshot(ctx.db);
    const res = await send(lead, csv(rows), '0');
    expect(res.status).toBe(200);
    expect(res.body.changes).toEqual({ episodesCreated: 0, episodesUpdated: 1, assessmentsCreated: 0, assessmentsUpdated: 2, rowsUnchanged: 3 });
    const after = await snapshot(ctx.db);
    expect(after.episode!.split(':')[0]).toBe(before.episode!.split(':')[0]); // no new rows: updated in place
    expect(after.assessment!.split(':')[0]).toBe(before.assessment!.split(':')[0]);
    const [e1] = await ctx.db.select().from(episodes).where(and(eq(episodes.clinicId, clinicId), eq(episodes.reference, 'UC-1')));
    expect(e1).toMatchObject({ weightKg: 80, version: 2 });
    const d1 = (await lead.get(`/api/episodes/${e1!.id}`)).body;
    expect(d1.assessments[2].scores['nprs-first-step']).toBe(3);
    expect(d1.interventions.map((i: { code: string }) => i.code)).toEqual(['education-load', 'heel-raises']);
    const [audit] = await uploadAudits();
    expect(audit!.detail.changedEpisodes).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ reference: 'UC-1', fields: ['weightKg'], interventions: true, assessments: [{ timepoint: 'week12', assessedOn: '2025-08-25', change: 'updated', fields: ['scores.nprs-first-step'] }] }),
        expect.objectContaining({ reference: 'UC-2', assessments: [{ timepoint: 'week6', assessedOn: '2025-07-14', change: 'updated', fields: ['scores.groc'] }] }),
      ]),
    );
  });

  it('a later file adds a follow-up to a stored episode (its baseline is already stored)', async () => {
    const res = await send(lead, csv(episodeRows('UC-3', 3).slice(3)), '0');
    expect(res.status).toBe(200);
    expect(res.body.changes).toMatchObject({ assessmentsCreated: 1, episodesCreated: 0 });
    const stale = csv(episodeRows('UC-3', 0, { pseudonym: 'a'.repeat(64) }));
    const refused = await send(lead, stale, '1');
    expect(refused.status).toBe(422);
    expect(refused.body.errors[0].message).toMatch(/stored with a different pseudonym/);
  });

  it('another clinic’s file with the same references creates that clinic’s own episodes', async () => {
    const res = await send(otherLead, file, '0');
    expect(res.body.changes).toMatchObject({ episodesCreated: 3 });
  });

  it('serves a template (header and two example rows) that itself passes a dry run', async () => {
    const res = await lead.get('/api/uploads/template.csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const rows = parse(res.text) as string[][];
    expect(rows[0]).toEqual(UPLOAD_COLUMNS.map((c) => c.name));
    expect(rows).toHaveLength(3);
    const check = await send(lead, res.text, '1');
    expect(check.status, JSON.stringify(check.body)).toBe(200);
    expect(check.body.changes).toMatchObject({ episodesCreated: 1, assessmentsCreated: 2 });
  });

  it('reads a UTF-8 file with a byte-order mark, CRLF line ends, quoted cells and mixed-case values', async () => {
    const rows = episodeRows('UC-BOM', 1, { sex: 'Female', standing_work: 'No', interventions: 'education-load; heel-raises:1' });
    const text = `\ufeff${csv(rows)}`.replace('UC-BOM,', '"UC-BOM",');
    const res = await send(lead, text, '1');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.changes).toMatchObject({ episodesCreated: 1, assessmentsCreated: 2 });
  });

  it('a corrected status discharges the episode through the file', async () => {
    const res = await send(lead, csv(episodeRows('UC-2', 1, { status: 'discharged', discharge_date: '2025-07-14', discharge_reason: 'goals-met' })), '0');
    expect(res.status).toBe(200);
    const [e2] = await ctx.db.select().from(episodes).where(and(eq(episodes.clinicId, clinicId), eq(episodes.reference, 'UC-2')));
    expect(e2).toMatchObject({ status: 'discharged', dischargeDate: '2025-07-14', dischargeReason: 'goals-met' });
  });
});
