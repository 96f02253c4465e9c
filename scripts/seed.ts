/**
 * The invented demo registry: fictional clinics (and, as the data issues land, people and episodes).
 * Nothing here describes a real person or clinic.
 */
import { sql } from 'drizzle-orm';
import type { Db } from '../server/db/client';
import { clinics } from '../server/db/schema';

export const DEMO_PASSWORD = 'loadline-demo';
export const DEMO_USERS = [
  { role: 'steward', email: 'steward@demo.loadline.test' },
  { role: 'lead', email: 'lead@demo.loadline.test' },
  { role: 'clinician', email: 'clinician@demo.loadline.test' },
  { role: 'researcher', email: 'researcher@demo.loadline.test' },
] as const;

export type DemoSummary = { clinics: number; episodes: number };

const DEMO_CLINICS = [
  { code: 'C01', displayName: 'Harbourside Movement Clinic', region: 'North Coast' },
  { code: 'C02', displayName: 'Willowbank Physio', region: 'North Coast' },
  { code: 'C03', displayName: 'Old Mill Rehabilitation', region: 'North Coast' },
  { code: 'C04', displayName: 'Kestrel Lane Physiotherapy', region: 'Inland Valley' },
  { code: 'C05', displayName: 'Granite Street Health', region: 'Inland Valley' },
  { code: 'C06', displayName: 'Riverside Foot & Gait', region: 'Inland Valley' },
];

/** Loads the demo scenario when the registry holds no clinic yet; returns what it loaded, or null. */
export async function loadDemoIfEmpty(db: Db): Promise<DemoSummary | null> {
  const [row] = await db.select({ n: sql<number>`count(*)::int` }).from(clinics);
  if ((row?.n ?? 0) > 0) return null;
  await db.insert(clinics).values(DEMO_CLINICS);
  return { clinics: DEMO_CLINICS.length, episodes: 0 };
}
