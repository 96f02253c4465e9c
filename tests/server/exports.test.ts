import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { auditEvents, exportLog } from '../../server/db/schema';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { randomSpecs, seedDataset, type Dataset, type EpisodeSpec } from './exports-fixtures';
import { approvedRequest, classSizes, download, sha256, QI_COLUMNS } from './exports-helpers';

const ctx = testApp();
let data: Dataset;
let researcher: Client;
let steward: Client;

const INJECTION_REGIONS = ['=cmd', '+cmd', '-cmd', '@cmd', '\tcmd', '\rcmd'];

/** Five alike episodes per odd-named region, so k = 5 keeps them (and their region) in the file. */
function injectionSpecs(): EpisodeSpec[] {
  return INJECTION_REGIONS.flatMap((_, r) =>
    Array.from({ length: 5 }, (_, i): EpisodeSpec => ({
      clinic: 3 + r,
      startDate: `2024-02-1${i}`,
      ageYears: 41,
      sex: 'female',
      heightCm: 170.43,
      weightKg: 65.27,
      activityProfile: 'runner',
      symptomWeeks: 20,
      consent: true,
      baseline: { 'nprs-first-step': 4, lefs: 50 },
      // Pain went up: a negative change, which must stay a plain number.
      followUps: [{ day: 84, scores: { 'nprs-first-step': 7, lefs: 45, groc: -5 } }],
      interventions: ['education-load'],
    })),
  );
}

beforeAll(async () => {
  const specs = [...randomSpecs(200, 3, 90210), ...injectionSpecs()];
  specs.push({ ...specs[0]!, ageYears: 93, sex: 'other', consent: true }); // a rare combination
  data = await seedDataset(ctx.db, ['Test North', 'Test South', 'Test North', ...INJECTION_REGIONS], specs);
  researcher = await signedInClient(ctx.app, (await createUser(ctx.db, 'researcher')).email);
  steward = await signedInClient(ctx.app, (await createUser(ctx.db, 'steward')).email);
});
afterAll(() => ctx.close());

const consenting = () => data.episodes.filter((e) => e.consent);

describe('de-identified export', () => {
  it('contains no identifier, clinic name, calendar date, height or weight, and only consenting episodes', async () => {
    const id = await approvedRequest(researcher, steward, data.condition);
    const d = await download(researcher, `/api/data-requests/${id}/export.csv`);
    expect(d.status).toBe(200);
    const header = Object.keys(d.rows[0]!);
    for (const h of header) expect(h).not.toMatch(/pseudonym|reference|name|date|height|weight|^bmi$/);
    const suppressed = Number(d.headers['x-export-suppressed-rows']);
    expect(d.rows.length).toBe(Number(d.headers['x-export-rows']));
    expect(d.rows.length + suppressed).toBe(consenting().length);
    expect(d.rows.length).toBeGreaterThan(consenting().length / 2); // generalisation keeps most rows
    const forbidden = [
      ...data.episodes.flatMap((e) => [e.pseudonym, e.reference, ...e.dates, String(e.heightCm), String(e.weightKg)]),
      ...data.clinics.map((c) => c.displayName),
      ...data.clinics.map((c) => c.code),
    ];
    expect(forbidden.length).toBeGreaterThan(500);
    const violations: string[] = [];
    for (const row of d.rows) {
      for (const [col, value] of Object.entries(row)) {
        if (/\d{4}-\d{2}-\d{2}/.test(value)) violations.push(`${col}: date-like ${value}`);
        for (const f of forbidden) if (value.includes(f)) violations.push(`${col} holds ${f}`);
      }
    }
    expect(violations).toEqual([]);
    // Heights and weights are nowhere, not even as BMI (not allowed on this request).
    expect(header).not.toContain('bmi');
  });

  it('gives every export new study ids and site codes, so two exports cannot be joined', async () => {
    const id = await approvedRequest(researcher, steward, data.condition, { groups: [] });
    const a = await download(researcher, `/api/data-requests/${id}/export.csv`);
    const b = await download(researcher, `/api/data-requests/${id}/export.csv`);
    const idsA = new Set(a.rows.map((r) => r.study_id));
    expect(idsA.size).toBe(a.rows.length);
    expect(b.rows.some((r) => idsA.has(r.study_id!))).toBe(false);
    const sitesA = new Set(a.rows.map((r) => r.clinic_code));
    expect(b.rows.some((r) => sitesA.has(r.clinic_code!))).toBe(false);
    expect(sha256(a.bytes)).not.toBe(sha256(b.bytes));
  });

  it('holds k-anonymity on the quasi-identifiers of the file, for the default k and a stricter one', async () => {
    for (const approve of [{}, { k: 9, startGranularity: 'quarter' }]) {
      const k = (approve as { k?: number }).k ?? 5;
      const id = await approvedRequest(researcher, steward, data.condition, { groups: [], approve });
      const d = await download(researcher, `/api/data-requests/${id}/export.csv`);
      expect(Number(d.headers['x-export-k'])).toBe(k);
      for (const [key, n] of classSizes(d.rows)) expect(n, key).toBeGreaterThanOrEqual(k);
      const changed = Number(d.headers['x-export-generalised-rows']) + Number(d.headers['x-export-suppressed-rows']);
      expect(changed).toBeGreaterThan(0); // random data always has rare combinations
      for (const r of d.rows) {
        expect(r.age_band).toMatch(/^(\d{2}-\d{2}|\d{2}\+)$/);
        expect(r.start_period).toMatch(/^\d{4}(-Q[1-4])?$/);
        for (const c of QI_COLUMNS) expect(r[c]).toBeDefined();
      }
      expect(d.rows.every((r) => r.age_band !== '90-94')).toBe(true);
    }
  });

  it('neutralises formula-like text cells and keeps negative numbers as numbers', async () => {
    const id = await approvedRequest(researcher, steward, data.condition);
    const d = await download(researcher, `/api/data-requests/${id}/export.csv`);
    for (const region of INJECTION_REGIONS) {
      const rows = d.rows.filter((r) => r.clinic_region === `'${region}`);
      expect(rows.length, JSON.stringify(region)).toBe(5);
    }
    const dict = await researcher.get(`/api/data-requests/${id}/dictionary?format=csv`);
    const textColumns = dict.text
      .split('\n')
      .slice(1)
      .map((l) => l.split(','))
      .filter((c) => c[2] === 'text' || c[2] === 'category')
      .map((c) => c[0]!);
    expect(textColumns).toContain('clinic_region');
    for (const r of d.rows) for (const c of textColumns) expect(r[c] ?? '', c).not.toMatch(/^[=+\-@\t\r]/);
    const worse = d.rows.filter((r) => r.clinic_region === "'=cmd");
    expect(worse.every((r) => r.nprs_first_step_change === '-3' && r.groc_followup === '-5')).toBe(true);
    expect(d.text).toMatch(/,-3,/);
  });

  it('offers raw BMI only when the steward allowed it, and never beside a generalised band', async () => {
    const id = await approvedRequest(researcher, steward, data.condition, {
      groups: [],
      approve: { allowRawBmi: true },
    });
    const d = await download(researcher, `/api/data-requests/${id}/export.csv`);
    expect(Object.keys(d.rows[0]!)).toContain('bmi');
    for (const r of d.rows) {
      if (r.bmi_band === '*') expect(r.bmi).toBe('');
      else expect(Number(r.bmi)).toBeGreaterThan(10);
    }
  });

  it('audits every export with its row count and the SHA-256 of the bytes sent', async () => {
    const id = await approvedRequest(researcher, steward, data.condition);
    const d = await download(researcher, `/api/data-requests/${id}/export.csv`);
    const [log] = await ctx.db.select().from(exportLog).where(eq(exportLog.requestId, id));
    expect(log).toMatchObject({
      status: 'completed',
      rowCount: d.rows.length,
      sha256: sha256(d.bytes),
      byteCount: d.bytes.length,
      k: 5,
    });
    const events = await ctx.db
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.entity, 'data_request'),
          eq(auditEvents.entityId, String(id)),
          eq(auditEvents.action, 'export'),
        ),
      );
    expect(events).toHaveLength(1);
    expect(events[0]!.detail).toMatchObject({ rowCount: d.rows.length, sha256: sha256(d.bytes), status: 'completed' });
    const logScreen = await steward.get('/api/exports');
    expect(logScreen.body.items.find((e: { requestId: number }) => e.requestId === id)).toMatchObject({
      rowCount: d.rows.length,
      status: 'completed',
    });
    expect((await researcher.get('/api/exports')).status).toBe(403);
  });

  it('offers the data dictionary in Markdown and CSV with exactly the columns of the file', async () => {
    const id = await approvedRequest(researcher, steward, data.condition, { groups: ['scores', 'interventions'] });
    const d = await download(researcher, `/api/data-requests/${id}/export.csv`);
    const header = Object.keys(d.rows[0]!);
    const md = await researcher.get(`/api/data-requests/${id}/dictionary?format=md`);
    expect(md.status).toBe(200);
    expect(md.headers['content-type']).toMatch(/markdown/);
    for (const h of header) expect(md.text).toContain(`| ${h} |`);
    const csv = await researcher.get(`/api/data-requests/${id}/dictionary?format=csv`);
    expect(
      csv.text
        .trim()
        .split('\n')
        .slice(1)
        .map((l) => l.split(',')[0]),
    ).toEqual(header);
    expect(header).toContain('int_toe_flexor');
    expect(header).not.toContain('recovery_event');
  });
});
