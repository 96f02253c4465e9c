import net from 'node:net';
import { openDatabase } from '../server/db/client';
import { migrateDatabase } from '../server/db/migrate';
import { APP_DATABASE, createDatabase, ensurePostgres } from './db';
import { loadDemoIfEmpty, type DemoSummary } from './seed';

/** Starts PostgreSQL, creates and migrates the app database, loads the demo when it is empty. */
export async function prepareAppDatabase(): Promise<{ url: string; demo: DemoSummary | null }> {
  const cluster = await ensurePostgres();
  const url = await createDatabase(cluster, APP_DATABASE);
  const database = openDatabase(url, 4);
  try {
    await migrateDatabase(database.db);
    const demo = await loadDemoIfEmpty(database.db);
    return { url, demo };
  } finally {
    await database.pool.end();
  }
}

export function fail(e: unknown): never {
  console.error(`loadline: ${e instanceof Error ? e.message : String(e)}`);
  process.exit(1);
}

/** Fails before any slow work when the app's port is taken. */
export async function assertPortFree(host: string, port: number): Promise<void> {
  const free = await new Promise<boolean>((resolve) => {
    const srv = net.createServer();
    srv.once('error', () => resolve(false));
    srv.listen(port, host, () => srv.close(() => resolve(true)));
  });
  if (!free) throw new Error(`Port ${port} on ${host} is already in use; stop the other program or set PORT to a free port`);
}
