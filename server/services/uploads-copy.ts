import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';

/**
 * Sends `lines` (COPY text format, each ending in a newline) with `COPY table (columns) FROM STDIN`. Resolves
 * once PostgreSQL has taken them in (triggers included), rejects with its error (never left as an unhandled
 * stream error).
 */
export function copyIn(client: pg.PoolClient, table: string, columns: readonly string[], lines: string): Promise<void> {
  if (lines === '') return Promise.resolve();
  return new Promise((resolve, reject) => {
    const stream = client.query(copyFrom(`copy ${table} (${columns.join(', ')}) from stdin`));
    stream.on('error', reject);
    stream.on('finish', () => resolve());
    stream.end(lines);
  });
}

const SPECIAL = /[\\\t\n\r]/;

/** One value in COPY text format: \N for null, backslash escapes for the few characters that need one. */
export function copyValue(v: string | number | boolean | null | undefined): string {
  if (v === null || v === undefined) return '\\N';
  if (typeof v === 'boolean') return v ? 't' : 'f';
  if (typeof v === 'number') return String(v);
  if (!SPECIAL.test(v)) return v;
  return v.replace(/[\\\t\n\r]/g, (c) => (c === '\\' ? '\\\\' : c === '\t' ? '\\t' : c === '\n' ? '\\n' : '\\r'));
}
