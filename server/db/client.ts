import pg from 'pg';
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema>;
export type Database = { pool: pg.Pool; db: Db };

// DATE columns come back as 'YYYY-MM-DD' strings, never as JS Dates shifted by a time zone.
pg.types.setTypeParser(pg.types.builtins.DATE, (v) => v);
// bigint counts fit comfortably in a double for a registry of this size.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));

export function openDatabase(url: string, max = 10): Database {
  const pool = new pg.Pool({ connectionString: url, max, connectionTimeoutMillis: 5000 });
  // An idle client losing its server (a database restart) must not crash the process.
  pool.on('error', () => undefined);
  return { pool, db: drizzle(pool, { schema, casing: 'snake_case' }) };
}
