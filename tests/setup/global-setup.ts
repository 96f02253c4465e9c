import { randomBytes } from 'node:crypto';
import type { TestProject } from 'vitest/node';
import { openDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { createDatabase, dropDatabase, ensurePostgres } from '../../scripts/db';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

/** One throw-away, migrated database per test run; dropped when the run ends. */
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const cluster = await ensurePostgres();
  const name = `loadline_test_${process.pid}_${randomBytes(3).toString('hex')}`;
  const url = await createDatabase(cluster, name, false);
  const database = openDatabase(url, 2);
  await migrateDatabase(database.db);
  await database.pool.end();
  project.provide('databaseUrl', url);
  return async () => {
    await dropDatabase(cluster, name);
  };
}
