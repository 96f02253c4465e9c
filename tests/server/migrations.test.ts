import { describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { openDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { createDatabase, dropDatabase, ensurePostgres } from '../../scripts/db';

describe('migrations', () => {
  it('migrate an empty database, creates every table, and a second run is a no-op', async () => {
    const cluster = await ensurePostgres();
    const name = `loadline_migr_${randomBytes(3).toString('hex')}`;
    const database = openDatabase(await createDatabase(cluster, name, false), 2);
    try {
      const tables = async () =>
        (
          await database.db.execute<{ table_name: string }>(
            sql`select table_name from information_schema.tables where table_schema = 'public' order by 1`,
          )
        ).rows.map((r) => r.table_name);
      expect(await tables()).toEqual([]);
      await migrateDatabase(database.db);
      const after = await tables();
      expect(after).toContain('clinic');
      await migrateDatabase(database.db);
      expect(await tables()).toEqual(after);
      const applied = await database.db.execute(sql`select count(*)::int as n from drizzle.__drizzle_migrations`);
      expect(applied.rows[0]).toEqual({ n: expect.any(Number) });
    } finally {
      await database.pool.end();
      await dropDatabase(cluster, name);
    }
  });
});
