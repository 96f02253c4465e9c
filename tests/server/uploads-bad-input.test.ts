import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { gzipSync } from 'node:zlib';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { createClinic, snapshot } from './episodes-fixtures';
import { csv, episodeRows, HEADER, bulkCsv } from './uploads-fixtures';

const ctx = testApp();
let lead: Client;
afterAll(() => ctx.close());
beforeAll(async () => {
  const clinic = await createClinic(ctx.db, 'UPB');
  lead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', clinic.id)).email);
});

const send = (body: Buffer | string, dryRun = '0', name = 'episodes.csv') =>
  lead.post(`/api/uploads/episodes?dryRun=${dryRun}`).attach('file', Buffer.isBuffer(body) ? body : Buffer.from(body, 'utf8'), name);

type Issue = { row: number; column: string | null; message: string };

/** Sends a bad file for commit and for a dry run: each answers 422 (or 413) naming the problem, and nothing is written. */
async function refuses(body: Buffer | string, match: RegExp, where?: Partial<Issue>, status = 422) {
  const before = await snapshot(ctx.db);
  for (const dryRun of ['0', '1']) {
    const res = await send(body, dryRun);
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(status);
    const issues: Issue[] = res.body.errors ?? res.body.error?.issues ?? [];
    const hit = issues.find((i) => match.test(i.message)) ?? (match.test(res.body.error?.message) ? { row: 0, column: null, message: res.body.error.message } : undefined);
    expect(hit, JSON.stringify(res.body).slice(0, 600)).toBeDefined();
    if (where) expect(hit).toMatchObject(where);
    if (status === 422) expect(res.body).toMatchObject({ accepted: expect.any(Number), rejected: expect.any(Number), uploadId: null });
  }
  expect(await snapshot(ctx.db)).toEqual(before);
}

describe('CSV upload: bad input is refused clearly and writes nothing', () => {
  it('wrong delimiter', () => refuses(csv(episodeRows('D-1'), HEADER, ';'), /separated by “;”, not commas/));
  it('not UTF-8: Latin-1 bytes', () => {
    const text = csv(episodeRows('L-1')).replace('male', 'mâle');
    return refuses(Buffer.from(text, 'latin1'), /not UTF-8 text.*0xe2.*Latin-1/);
  });
  it('not UTF-8: a UTF-16 byte-order mark', () => refuses(Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(csv(episodeRows('U-1')), 'utf16le')]), /UTF-16/));
  it('missing columns', () => refuses(csv(episodeRows('M-1'), HEADER.filter((h) => h !== 'side')), /required column “side” is missing/, { row: 1, column: 'side' }));
  it('unknown columns', () => {
    const rows = episodeRows('K-1').map((r) => ({ ...r, patient_name: 'x' }));
    return refuses(csv(rows, [...HEADER, 'patient_name']), /Unknown column “patient_name”/, { row: 1, column: 'patient_name' });
  });
  it('duplicated header', () => refuses(csv(episodeRows('H-1'), [...HEADER, 'sex']), /“sex” appears twice/, { row: 1 }));
  it('empty file', () => refuses('', /empty/));
  it('header only', () => refuses(`${HEADER.join(',')}\n`, /no data rows/));
  it('rows of unequal length', () => {
    const text = csv(episodeRows('R-1')).split('\r\n');
    text[2] = `${text[2]},extra`;
    return refuses(text.join('\r\n'), /has 29 cells but the header has 28/, { row: 3 });
  });
  it('one pass names every problem of a row: unreadable cells and out-of-range scores beside them', async () => {
    const rows = episodeRows('A-1', 1);
    Object.assign(rows[1]!, { avg_daily_steps: 'lots', score_nprs_first_step: '14', score_groc: '-9' });
    const before = await snapshot(ctx.db);
    const res = await send(csv(rows), '1');
    expect(res.status).toBe(422);
    const onRow = (res.body.errors as Issue[]).filter((i) => i.row === 3).map((i) => i.column).sort();
    expect(onRow).toEqual(['avg_daily_steps', 'score_groc', 'score_nprs_first_step']);
    expect(await snapshot(ctx.db)).toEqual(before);
  });
  it('out-of-range scores', () => refuses(csv(episodeRows('S-1', 1, { score_nprs_first_step: '12' })), /\(nprs-first-step\) runs from 0 to 10; 12 is outside/, { row: 2, column: 'score_nprs_first_step' }));
  it('out-of-range GROC (negative numbers are read as numbers)', () => {
    const rows = episodeRows('G-1', 1);
    rows[1]!.score_groc = '-9';
    return refuses(csv(rows), /runs from −7 to 7; −9 is outside/, { row: 3, column: 'score_groc' });
  });
  it('impossible dates', () => refuses(csv(episodeRows('T-1', 1, { start_date: '2025-02-30' })), /does not exist/, { row: 2, column: 'start_date' }));
  it('a date in another format', () => refuses(csv(episodeRows('T-2', 1, { start_date: '02/06/2025' })), /Use a date like/, { column: 'start_date' }));
  it('follow-up before baseline', () => {
    const rows = episodeRows('F-1', 1);
    rows[1]!.assessed_on = '2025-05-30';
    return refuses(csv(rows), /follow-up \(2025-05-30\) cannot be dated before the baseline \(2025-06-02\)/, { row: 3, column: 'assessed_on' });
  });
  it('conflicting episode fields between rows of one episode', () => {
    const rows = episodeRows('C-1', 2);
    rows[2]!.age_years = '52';
    return refuses(csv(rows), /age_years “51” on row 2 but “52” here/, { row: 4, column: 'age_years' });
  });
  it('a pseudonym that is not a hash', () => refuses(csv(episodeRows('P-1', 1, { pseudonym: 'Jane Doe' })), /64 hexadecimal characters/, { column: 'pseudonym' }));
  it('a formula-like cell in a text field', async () => {
    await refuses(csv(episodeRows('X-1', 1, { episode_reference: '=HYPERLINK("x")' })), /like a spreadsheet formula/, { column: 'episode_reference' });
    await refuses(csv(episodeRows('X-2', 1, { side: '@left' })), /like a spreadsheet formula/, { column: 'side' });
    await refuses(csv(episodeRows('X-3', 1, { adverse_event: '-flare' })), /like a spreadsheet formula/, { column: 'adverse_event' });
    await refuses(csv(episodeRows('X-4', 1, { interventions: 'education-load;+taping' })), /like a spreadsheet formula/, { column: 'interventions' });
    await refuses(csv(episodeRows('X-5', 1, { score_faam_adl: '=1+1' })), /like a spreadsheet formula/, { column: 'score_faam_adl' });
  });
  it('a reference that looks like an e-mail, a phone number or a date', async () => {
    await refuses(csv(episodeRows('x', 0, { episode_reference: 'pat@clinic.example' })), /looks like an e-mail/, { column: 'episode_reference' });
    await refuses(csv(episodeRows('x', 0, { episode_reference: '07700900123' })), /looks like a phone number/);
    await refuses(csv(episodeRows('x', 0, { episode_reference: 'P-12.03.60' })), /looks like a date/);
  });
  it('a new episode without a baseline, and a second baseline', async () => {
    await refuses(csv(episodeRows('N-1', 2).slice(1)), /is new and has no baseline row/, { row: 2, column: 'timepoint' });
    const rows = episodeRows('N-2', 1);
    rows[1]!.timepoint = 'baseline';
    await refuses(csv(rows), /A second baseline for episode “N-2” \(see row 2\)/, { row: 3 });
  });
  it('a level on an intervention without levels, and an unknown code', async () => {
    await refuses(csv(episodeRows('I-1', 0, { interventions: 'taping:2' })), /has no levels/, { column: 'interventions' });
    await refuses(csv(episodeRows('I-2', 0, { interventions: 'cold-plunge' })), /Unknown intervention code “cold-plunge”/);
  });
  it('a discharged episode without a discharge date', () => refuses(csv(episodeRows('Q-1', 0, { status: 'discharged' })), /Enter the discharge date/, { column: 'discharge_date' }));
  it('one bad row among good ones rejects the whole file, and counts accepted and rejected rows', async () => {
    const rows = [...episodeRows('B-1', 2), ...episodeRows('B-2', 2, { sex: 'unknown' }), ...episodeRows('B-3', 2)];
    await refuses(csv(rows), /Use one of: female, male, other/);
    const res = await send(csv(rows), '1');
    expect(res.body).toMatchObject({ accepted: 6, rejected: 3 });
    expect(res.body.errors.map((e: Issue) => e.row)).toEqual([5, 6, 7]);
  });
  it('rows are numbered as a spreadsheet shows them: an empty line is a row, a cell with a line break is not two', async () => {
    const [first, second, third] = episodeRows('N-1', 2).map((r) => csv([r]).split('\r\n')[1]!);
    const broken = second!.replace('left', '"left\r\nright"'); // the side cell of row 4 spans two lines of the file
    const scoreTooHigh = third!.replace(/,(\d+),(\d+),(\d+),,,/, ',12,$2,$3,,,');
    const text = [HEADER.join(','), first, '', broken, scoreTooHigh, ''].join('\r\n');
    await refuses(text, /Use one of: left, right/, { row: 4, column: 'side' });
    await refuses(text, /12 is outside/, { row: 5, column: 'score_nprs_first_step' });
  });
  it('a quote left open is refused near the row where it opens', async () => {
    const text = `${csv(episodeRows('O-1', 1))}O-2,"${'a'.repeat(10)}\r\n`;
    await refuses(text, /not valid CSV near row 4: .*[Qq]uote/, { row: 4 });
  });
  it('a file over 10 MiB is 413', () => refuses(Buffer.alloc(10 * 1024 * 1024 + 1, 'a'), /larger than 10 MiB/, undefined, 413));
  it('more than 100,000 rows is 413', async () => {
    const before = await snapshot(ctx.db);
    const res = await send(gzipSync(bulkCsv(100_001, 'Z')), '0'); // one pass only: this file is large
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/100,001 data rows; the limit is 100,000/);
    expect(await snapshot(ctx.db)).toEqual(before);
  }, 60_000);
  it('asks for dryRun and for the file field', async () => {
    const before = await snapshot(ctx.db);
    const noFlag = await lead.post('/api/uploads/episodes').attach('file', Buffer.from(csv(episodeRows('Y-1'))), 'a.csv');
    expect(noFlag.status).toBe(422);
    expect(JSON.stringify(noFlag.body)).toMatch(/dryRun=1 to check/);
    const noFile = await lead.post('/api/uploads/episodes?dryRun=1').field('note', 'x');
    expect(noFile.status).toBe(422);
    expect(noFile.body.error.message).toMatch(/form field “file”/);
    const wrongField = await lead.post('/api/uploads/episodes?dryRun=1').attach('upload', Buffer.from('a'), 'a.csv');
    expect(wrongField.status).toBe(422);
    expect(await snapshot(ctx.db)).toEqual(before);
  });
});
