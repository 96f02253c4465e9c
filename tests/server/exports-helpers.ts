import { createHash } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import { expect } from 'vitest';
import type { Client } from '../setup/auth';

/** Creates a cohort on `condition`, turns it into a request and has the steward approve it; returns the request id. */
export async function approvedRequest(
  researcher: Client,
  steward: Client,
  condition: string,
  opts: { groups?: string[]; approve?: Record<string, unknown>; criteria?: Record<string, unknown> } = {},
): Promise<number> {
  const cohort = await researcher
    .post('/api/cohorts')
    .send({ name: 'Export cohort', criteria: { conditionCode: condition, ...opts.criteria } });
  expect(cohort.status).toBe(201);
  const req = await researcher.post('/api/data-requests').send({
    cohortId: cohort.body.id,
    purpose: 'Time to recovery by activity profile for a practice-based outcomes study',
    variableGroups: opts.groups ?? ['subgroups', 'scores', 'change', 'recovery', 'interventions', 'care'],
  });
  expect(req.status).toBe(201);
  const ok = await steward
    .post(`/api/data-requests/${req.body.id}/approve`)
    .send({ expiresOn: '2099-12-31', ...opts.approve });
  expect(ok.status).toBe(200);
  return req.body.id as number;
}

export type Download = {
  status: number;
  bytes: Buffer;
  text: string;
  headers: Record<string, string>;
  rows: Record<string, string>[];
};

/** Downloads an export as raw bytes (for the hash) and parses it with csv-parse. */
export async function download(client: Client, url: string): Promise<Download> {
  const res = await client
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(Buffer.from(c)));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
  const bytes = res.body as Buffer;
  const text = bytes.toString('utf8');
  const rows =
    res.status === 200 && /text\/csv/.test(String(res.headers['content-type']))
      ? (parse(text, { columns: true }) as Record<string, string>[])
      : [];
  return { status: res.status, bytes, text, headers: res.headers as Record<string, string>, rows };
}

export const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

export const QI_COLUMNS = ['age_band', 'sex', 'bmi_band', 'activity_profile', 'start_period', 'clinic_region'];

/** The size of every quasi-identifier combination in the parsed file. */
export function classSizes(rows: Record<string, string>[]): Map<string, number> {
  const sizes = new Map<string, number>();
  for (const r of rows) {
    const key = QI_COLUMNS.map((c) => r[c]).join('|');
    sizes.set(key, (sizes.get(key) ?? 0) + 1);
  }
  return sizes;
}
