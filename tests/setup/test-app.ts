import { inject } from 'vitest';
import { createApp } from '../../server/app';
import { openDatabase, type Database } from '../../server/db/client';

export type TestContext = Database & { app: ReturnType<typeof createApp>; logs: string[]; close(): Promise<void> };

/** The real Express app on the run's throw-away PostgreSQL database (no mocks). */
export function testApp(): TestContext {
  const database = openDatabase(inject('databaseUrl'), 5);
  const logs: string[] = [];
  const app = createApp({ ...database, log: (m) => logs.push(m) });
  return { ...database, app, logs, close: () => database.pool.end() };
}
