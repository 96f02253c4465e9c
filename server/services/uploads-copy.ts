import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';

/**
 * COPY text made line by line, kept as UTF-8 pieces of about 16 kB. One string grown by `+=` for a whole chunk
 * is a rope of one small object per line, flattened only when it is sent; until then the garbage collector
 * copies every one of those objects from one young space to the other (measured: the 100,000-row commit's
 * young collections took 0.85 s against 0.24 s for the same file's dry run). A piece becomes bytes as soon as
 * it is full: one object, outside the young space.
 */
export class CopyText {
  private readonly pieces: Buffer[] = [];
  private current = '';

  add(line: string): void {
    this.current += line;
    if (this.current.length >= 16_384) {
      this.pieces.push(Buffer.from(this.current));
      this.current = '';
    }
  }

  /** The pieces, the last one included (call once the last line is added). */
  done(): Buffer[] {
    if (this.current !== '') this.pieces.push(Buffer.from(this.current));
    this.current = '';
    return this.pieces;
  }
}

/**
 * Sends `pieces` (COPY text format, lines ending in a newline) with `COPY table (columns) FROM STDIN`. Resolves
 * once PostgreSQL has taken them in (triggers included), rejects with its error (never left as an unhandled
 * stream error).
 */
export function copyIn(client: pg.PoolClient, table: string, columns: readonly string[], pieces: readonly Buffer[]): Promise<void> {
  if (pieces.length === 0) return Promise.resolve();
  return new Promise((resolve, reject) => {
    const stream = client.query(copyFrom(`copy ${table} (${columns.join(', ')}) from stdin`));
    stream.on('error', reject);
    stream.on('finish', () => resolve());
    for (const piece of pieces) stream.write(piece); // all in memory already: nothing to wait for between them
    stream.end();
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
