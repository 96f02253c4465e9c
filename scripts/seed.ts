/**
 * The invented demo registry: fictional clinics (and, as the data issues land, people and episodes).
 * Nothing here describes a real person or clinic.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { sql } from 'drizzle-orm';
import type { Db } from '../server/db/client';
import { clinics } from '../server/db/schema';
import { loadDemoEpisodes, type DemoEpisodeOptions } from './seed/load';
import { loadDemoUsers } from './seed/users';

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
export async function loadDemoIfEmpty(db: Db, episodeOptions: DemoEpisodeOptions = {}): Promise<DemoSummary | null> {
  const [row] = await db.select({ n: sql<number>`count(*)::int` }).from(clinics);
  if ((row?.n ?? 0) > 0) return null;
  await db.insert(clinics).values(DEMO_CLINICS);
  await loadDemoUsers(db);
  const episodes = await loadDemoEpisodes(db, episodeOptions);
  return { clinics: DEMO_CLINICS.length, episodes };
}

/** `npx tsx scripts/seed.ts [--episodes N] [--seed S] [--database-url URL]`: loads the demo into an empty database. */
async function main(argv: string[]): Promise<void> {
  const opt = (name: string) => {
    const i = argv.indexOf(name);
    return i === -1 ? undefined : argv[i + 1];
  };
  const episodes = opt('--episodes') === undefined ? undefined : Number(opt('--episodes'));
  if (episodes !== undefined && !(Number.isInteger(episodes) && episodes >= 0)) throw new Error('--episodes takes a whole number');
  const seed = opt('--seed') === undefined ? undefined : Number(opt('--seed'));
  const { openDatabase } = await import('../server/db/client');
  const { migrateDatabase } = await import('../server/db/migrate');
  const { APP_DATABASE, createDatabase, ensurePostgres } = await import('./db');
  const url = opt('--database-url') ?? (await createDatabase(await ensurePostgres(), APP_DATABASE));
  const database = openDatabase(url, 4);
  try {
    await migrateDatabase(database.db);
    const started = performance.now();
    const loaded = await loadDemoIfEmpty(database.db, { episodes, seed });
    const seconds = ((performance.now() - started) / 1000).toFixed(1);
    console.log(
      loaded
        ? `loadline: demo loaded (${loaded.clinics} clinics, ${loaded.episodes} episodes) in ${seconds} s`
        : 'loadline: the database already holds clinics; nothing loaded (use an empty database)',
    );
  } finally {
    await database.pool.end();
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main(process.argv.slice(2)).catch((e: unknown) => {
    console.error(`loadline: ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
