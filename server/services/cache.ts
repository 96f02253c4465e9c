import { sql } from 'drizzle-orm';
import type { Db } from '../db/client';

/**
 * The registry's data version and an in-process cache of computed analytics keyed by it.
 * Triggers (migrations 0008 and 0010) append a row to `registry_data_change` on every write statement to the
 * tables the numbers come from. The version is the count of committed rows: any committed write raises it
 * (a max(id) would not, when an older transaction commits after a newer one), so a key that includes the
 * version can never return numbers computed from older data.
 */

/** The current data version: a count over a narrow append-only table (one row per write statement). */
export async function readDataVersion(db: Db): Promise<number> {
  const { rows } = await db.execute<{ version: number }>(
    sql`select count(*)::bigint as version from registry_data_change`,
  );
  return Number(rows[0]?.version ?? 0);
}

/** A bounded map that forgets the least recently used entry first (Map keeps insertion order). */
export class LruCache<V> {
  private readonly map = new Map<string, V>();
  constructor(readonly maxEntries: number) {
    if (!Number.isInteger(maxEntries) || maxEntries < 1) throw new RangeError('LruCache needs maxEntries >= 1');
  }
  get(key: string): V | undefined {
    const v = this.map.get(key);
    if (v === undefined) return undefined;
    this.map.delete(key);
    this.map.set(key, v);
    return v;
  }
  set(key: string, value: V): void {
    this.map.delete(key);
    this.map.set(key, value);
    while (this.map.size > this.maxEntries) {
      const oldest = this.map.keys().next().value;
      if (oldest === undefined) break;
      this.map.delete(oldest);
    }
  }
  delete(key: string): void {
    this.map.delete(key);
  }
  get size(): number {
    return this.map.size;
  }
  clear(): void {
    this.map.clear();
  }
}

// A clinic-results answer can hold tens of thousands of change scores at registry scale; 200 keeps memory bounded.
const MAX_ENTRIES = 200;
// One cache per database handle, so two apps in one process (tests, benchmarks) never share entries.
const caches = new WeakMap<Db, { entries: LruCache<Promise<unknown>>; hits: number; misses: number }>();

function cacheOf(db: Db) {
  let c = caches.get(db);
  if (!c) {
    c = { entries: new LruCache<Promise<unknown>>(MAX_ENTRIES), hits: 0, misses: 0 };
    caches.set(db, c);
  }
  return c;
}

/**
 * Returns the cached value for (key, current data version), computing it once on a miss.
 * Concurrent requests for the same key share one computation (the promise is cached); a failed
 * computation is dropped so the next request tries again.
 */
export async function cachedByDataVersion<T>(
  db: Db,
  key: string,
  compute: (dataVersion: number) => Promise<T>,
): Promise<{ value: T; dataVersion: number; hit: boolean }> {
  const dataVersion = await readDataVersion(db);
  const c = cacheOf(db);
  const fullKey = `${dataVersion}|${key}`;
  const existing = c.entries.get(fullKey) as Promise<T> | undefined;
  if (existing) {
    c.hits++;
    return { value: await existing, dataVersion, hit: true };
  }
  c.misses++;
  const pending = compute(dataVersion);
  c.entries.set(fullKey, pending);
  try {
    return { value: await pending, dataVersion, hit: false };
  } catch (err) {
    c.entries.delete(fullKey);
    throw err;
  }
}

/** Hit and miss counts of one database's cache (for tests and the benchmark). */
export function cacheStats(db: Db): { hits: number; misses: number; entries: number } {
  const c = cacheOf(db);
  return { hits: c.hits, misses: c.misses, entries: c.entries.size };
}
