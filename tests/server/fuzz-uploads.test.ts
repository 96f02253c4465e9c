import fc from 'fast-check';
import { gzipSync } from 'node:zlib';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { UploadResultSchema } from '../../shared/schemas/upload';
import { UPLOAD_COLUMNS } from '../../shared/upload-columns';
import { consistencyProblems } from '../setup/consistency';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { testApp } from '../setup/test-app';
import { createClinic } from './episodes-fixtures';
import { invalidStoredEpisodes } from './fuzz-arbitraries';
import { csv, episodeRows, HEADER } from './uploads-fixtures';

// Random and boundary cells, headers and bytes against the real upload API: every answer is 200, the upload report
// (422), or a 4xx in the JSON error shape; never a 5xx. A refused file or a dry run writes nothing.
const ctx = testApp();
let client: Client;
let clinicId: number;
let n = 0;

beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'FUZU')).id;
  client = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', clinicId)).email);
});
afterAll(() => ctx.close());

async function counts() {
  const r = await ctx.db.execute(sql`select
    (select count(*) from episode where clinic_id = ${clinicId}) as e,
    (select count(*) from assessment a join episode e on e.id = a.episode_id where e.clinic_id = ${clinicId}) as a,
    (select count(*) from score s join assessment a on a.id = s.assessment_id join episode e on e.id = a.episode_id where e.clinic_id = ${clinicId}) as s,
    (select coalesce(sum(version), 0) from episode where clinic_id = ${clinicId}) as v,
    (select count(*) from upload where clinic_id = ${clinicId}) as u,
    (select count(*) from audit_event where clinic_id = ${clinicId}) as audit`);
  return r.rows[0];
}

const cell = fc.oneof(
  fc.constantFrom(
    '', ' ', '-1', '0', '-0', '+7', '7.', '.5', '1e400', '1e3', '0x10', 'NaN', 'Infinity', '1,5', '١٢', '\u00a0', '"', '""', 'a,b',
    'line\nbreak', '=1+1', '+cmd', '@x', '-x', '2025-02-29', '2024-02-29', '2025-6-2', 'yes', 'YES', 'no', 'true', '1', 'maybe',
    '9'.repeat(400), 'baseline', 'week12', 'left', 'both', 'plantar-heel-pain', 'education-load;heel-raises:4', 'toe-flexor@200',
    'heel-raises:2;heel-raises:3', ';;', 'jane@example.org', '+44 20 7946 0958', 'ff'.repeat(32), 'FF'.repeat(32), '\u0000', '\uFEFF',
  ),
  fc.string({ maxLength: 30 }),
  fc.integer({ min: -200, max: 200_000 }).map(String),
  fc.double({ noNaN: true }).map(String),
);

/** Valid values at the edges of some columns, so that mutated files are sometimes still valid. */
const EDGES: Record<string, string[]> = {
  symptom_weeks: ['0', '1040'], age_years: ['16', '110'], height_cm: ['100', '230', '180.5'], weight_kg: ['30', '300'],
  side: ['both', 'right'], sex: ['other'], condition: ['', 'plantar-heel-pain'], standing_work: ['no'], research_consent: ['no'],
  interventions: ['', 'education-load', 'heel-raises:3;toe-flexor@104'], reporter: ['', 'patient'], avg_daily_steps: ['', '0', '100000'],
  adverse_event: ['', 'bruising'], score_nprs_first_step: ['0', '10', ''], score_nprs_usual: ['0', '10'], score_faam_adl: ['0', '100'],
  score_lefs: ['0', '80'], score_psfs: ['0', '10', '2.3'], score_groc: ['', '-7', '7'],
};
const EPISODE_COLUMNS = new Set(UPLOAD_COLUMNS.filter((c) => c.level === 'episode').map((c) => c.name));
const change = fc
  .constantFrom(...HEADER)
  .chain((column) => fc.tuple(fc.nat({ max: 5 }), fc.constant(column), EDGES[column] ? fc.oneof(cell, fc.constantFrom(...EDGES[column]!)) : cell));

/**
 * A small valid file (two episodes of three rows) with one to four cells, or the header, replaced. An episode
 * column is changed on every row of its episode (the rows of an episode must agree), an assessment cell on one row.
 */
const mutatedFile = fc
  .record({
    cells: fc.array(change, { minLength: 1, maxLength: 4 }),
    // One file in four with a changed header: a column left out, doubled, unknown, or a shuffled subset.
    header: fc.oneof(
      { arbitrary: fc.constant(null), weight: 3 },
      fc.constantFrom(...HEADER).map((h) => HEADER.filter((x) => x !== h)),
      fc.constantFrom(...HEADER).map((h) => [...HEADER, h]),
      fc.string({ maxLength: 12 }).map((h) => [...HEADER, h]),
      fc.shuffledSubarray([...HEADER], { minLength: 1 }),
    ),
    lineEnd: fc.constantFrom('\r\n', '\n'),
    dryRun: fc.constantFrom('0', '1', 'true', 'false', '0', '1', 'maybe', ''),
    gzip: fc.boolean(),
  })
  .map((f) => {
    const prefix = `FU${(n++).toString(36)}x`;
    const rows = [...episodeRows(`${prefix}a`, 2), ...episodeRows(`${prefix}b`, 2)];
    for (const [row, column, value] of f.cells) {
      const targets = EPISODE_COLUMNS.has(column) ? (row < 3 ? [0, 1, 2] : [3, 4, 5]) : [row];
      for (const t of targets) rows[t]![column] = value;
    }
    const text = csv(rows, f.header ?? HEADER).replace(/\r\n/g, f.lineEnd);
    return { ...f, body: f.gzip ? gzipSync(text) : Buffer.from(text, 'utf8') };
  });

async function send(body: Buffer, dryRun: string, name: string) {
  const before = await counts();
  const res = await client.post(`/api/uploads/episodes?dryRun=${encodeURIComponent(dryRun)}`).attach('file', body, name);
  expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBeLessThan(500);
  if (res.status >= 400) expect(res.body).toMatchObject({ error: { message: expect.any(String) } });
  // 200 and a 422 about the file carry the upload report; a 422 about the dryRun parameter is a plain error with issues.
  if (res.status === 200 || (res.status === 422 && !res.body.error.issues)) {
    expect(UploadResultSchema.safeParse(res.body).success, JSON.stringify(res.body).slice(0, 300)).toBe(true);
  }
  const dry = dryRun === '1' || dryRun === 'true';
  if (res.status >= 400 || dry) expect(await counts()).toEqual(before);
  return res.status;
}

describe('fuzzing the CSV upload', () => {
  it('files with random and boundary cells, changed headers, gzip, and odd dryRun values', async () => {
    const seen = new Set<number>();
    await fc.assert(
      fc.asyncProperty(mutatedFile, async (f) => {
        seen.add(await send(f.body, f.dryRun, f.gzip ? 'visits.csv.gz' : 'visits.csv'));
      }),
      { numRuns: 150 },
    );
    expect(seen).toContain(422);
    expect(seen).toContain(200); // some mutations keep the file valid: the check is not vacuous
  });

  it('bytes that are not a CSV at all', async () => {
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 2000 }), fc.constantFrom('x.csv', 'x.csv.gz', 'x.bin', ''), async (bytes, name) => {
        await send(Buffer.from(bytes), '1', name || 'unnamed');
      }),
      { numRuns: 60 },
    );
    for (const raw of [Buffer.from([0x1f, 0x8b, 0x08, 0x00]), gzipSync(Buffer.from([0xff, 0xfe, 0x00])), Buffer.from('\uFEFF' + HEADER.join(','))]) {
      await send(raw, '0', 'broken.csv.gz');
    }
  });

  it('everything stored is valid, and the database is consistent', async () => {
    expect(await invalidStoredEpisodes(ctx.db, clinicId)).toEqual([]);
    expect(await consistencyProblems(ctx.db, [clinicId])).toEqual([]);
  });
});
