import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import type { Db } from './client';
import * as schema from './schema';

/** The pool behind a Drizzle handle (openDatabase always makes one). */
export function poolOf(db: Db): pg.Pool {
  const pool = (db as unknown as { $client: unknown }).$client;
  if (!(pool instanceof pg.Pool)) throw new Error('this needs a pg.Pool behind the Drizzle handle');
  return pool;
}

/**
 * Runs `fn` in one transaction on a connection of its own, handing it both the raw client (for COPY, which
 * Drizzle does not speak) and a Drizzle handle on the same connection. Commits when `fn` resolves; otherwise
 * rolls back and rethrows. A connection whose rollback failed is discarded, not returned to the pool.
 */
export async function withClientTransaction<T>(db: Db, fn: (client: pg.PoolClient, tx: Db) => Promise<T>): Promise<T> {
  return onOwnConnection(db, ['begin'], (client) => fn(client, drizzle(client, { schema, casing: 'snake_case' }) as unknown as Db));
}

/**
 * The transaction wrapper both raw-client transactions share: runs the `begin` statements, then `fn`, commits
 * when it resolves, otherwise rolls back and rethrows. A connection whose rollback failed is discarded.
 */
export async function onOwnConnection<T>(db: Db, begin: readonly string[], fn: (client: pg.PoolClient) => Promise<T>): Promise<T> {
  const client = await poolOf(db).connect();
  let broken: Error | undefined;
  try {
    for (const statement of begin) await client.query(statement);
    const result = await fn(client);
    await client.query('commit');
    return result;
  } catch (e) {
    await client.query('rollback').catch((err: unknown) => {
      broken = err instanceof Error ? err : new Error(String(err));
    });
    throw e;
  } finally {
    client.release(broken);
  }
}
