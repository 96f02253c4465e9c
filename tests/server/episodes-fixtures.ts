import { randomBytes, createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { Db } from '../../server/db/client';
import { clinics } from '../../server/db/schema';

/** A clinic of its own for each test file (the integration database is shared by the run). */
export async function createClinic(db: Db, label: string) {
  const code = `${label}${randomBytes(3).toString('hex')}`.toUpperCase().slice(0, 12);
  const [c] = await db.insert(clinics).values({ code, displayName: `Test clinic ${code}`, region: 'Test region' }).returning();
  return c!;
}

/** A pseudonym-shaped value for tests (the registry only checks the shape; real ones come from shared/pseudonym.ts). */
export const fakePseudonym = (seed: string) => createHash('sha256').update(seed).digest('hex');

let n = 0;
/** A valid new episode with its baseline; override any field. */
export function episodeInput(over: Record<string, unknown> = {}) {
  n++;
  return {
    pseudonym: fakePseudonym(`patient-${n}-${randomBytes(4).toString('hex')}`),
    reference: `T-E${randomBytes(4).toString('hex')}`,
    side: 'right',
    startDate: '2026-03-02',
    symptomWeeks: 10,
    ageYears: 44,
    sex: 'female',
    heightCm: 168,
    weightKg: 70,
    activityProfile: 'active',
    standingWork: false,
    researchConsent: true,
    baseline: { assessedOn: '2026-03-02', scores: { 'nprs-first-step': 7, 'nprs-usual': 5, 'faam-adl': 60 } },
    interventions: [{ code: 'education-load' }, { code: 'heel-raises', maxLevel: 2 }],
    ...over,
  };
}

const TABLES = ['episode', 'assessment', 'score', 'episode_intervention', 'audit_event', 'upload'] as const;

/** Row count and an md5 over every row of each registry table: equal snapshots mean nothing was written. */
export async function snapshot(db: Db): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const t of TABLES) {
    const r = await db.execute<{ n: number; h: string }>(
      sql`select count(*)::int as n, md5(coalesce(string_agg(x::text, '|' order by x::text), '')) as h from ${sql.identifier(t)} x`,
    );
    out[t] = `${r.rows[0]!.n}:${r.rows[0]!.h}`;
  }
  return out;
}
