import { describe, expect, it } from 'vitest';
import { randomBytes, createHmac, pbkdf2Sync } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { openDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { createDatabase, dropDatabase, ensurePostgres } from '../../scripts/db';
import { loadDemoIfEmpty } from '../../scripts/seed';
import { DEMO_CLINIC_SPECS, generateDemoEpisodes } from '../../scripts/seed/episodes';
import { DEMO_PASSPHRASE, DEMO_SEED } from '../../scripts/seed/load';
import { todayUtc } from '../../shared/follow-up-schedule';

describe('demo scenario (scripts/seed.ts) on an empty database of its own', () => {
  it('loads 6 clinics and 2,500 episodes with pseudonyms made as a clinic would, and loads nothing twice', async () => {
    const cluster = await ensurePostgres();
    const name = `loadline_demo_${randomBytes(3).toString('hex')}`;
    const database = openDatabase(await createDatabase(cluster, name, false), 4);
    try {
      await migrateDatabase(database.db);
      const started = performance.now();
      const loaded = await loadDemoIfEmpty(database.db);
      const seconds = (performance.now() - started) / 1000;
      console.log(`demo load: ${seconds.toFixed(1)} s`); // a figure for the report; the limit lives in the brief, not here
      expect(loaded).toEqual({ clinics: 6, episodes: 2500 });
      const count = async () =>
        (await database.db.execute<{ e: number; a: number; s: number; i: number; audit: number }>(sql`
          select (select count(*) from episode)::int e, (select count(*) from assessment)::int a, (select count(*) from score)::int s,
            (select count(*) from episode_intervention)::int i, (select count(*) from audit_event where entity = 'demo-scenario')::int audit`)).rows[0]!;
      const counts = await count();
      expect(counts.e).toBe(2500);
      expect(counts.a).toBeGreaterThan(2500 * 2);
      expect(counts.s).toBeGreaterThan(counts.a * 3);
      expect(counts.audit).toBe(6);

      // The same generator run gives the invented local identifiers: each stored pseudonym is
      // HMAC-SHA-256(PBKDF2-SHA-256(passphrase, clinic salt, 310,000), upper-cased identifier), checked with node:crypto.
      const today = todayUtc();
      const episodes = generateDemoEpisodes({ episodes: 2500, seed: DEMO_SEED, today, clinics: DEMO_CLINIC_SPECS });
      const sample = [episodes[0]!, episodes[1234]!, episodes[2499]!];
      for (const e of sample) {
        const [row] = (
          await database.db.execute<{ pseudonym: string; salt: string }>(sql`
            select e.pseudonym, c.pseudonym_salt as salt from episode e join clinic c on c.id = e.clinic_id
            where c.code = ${e.clinicCode} and e.reference = ${e.reference}`)
        ).rows;
        const key = pbkdf2Sync(DEMO_PASSPHRASE, Buffer.from(row!.salt, 'hex'), 310_000, 32, 'sha256');
        expect(row!.pseudonym).toBe(createHmac('sha256', key).update(e.localId.toUpperCase()).digest('hex'));
      }
      expect(await loadDemoIfEmpty(database.db)).toBeNull();
      expect(await count()).toEqual(counts);
    } finally {
      await database.pool.end();
      await dropDatabase(cluster, name);
    }
  }, 120_000);
});
