import type Cursor from 'pg-cursor';

/**
 * A server-side cursor's rows, batch by batch, with the next batch always asked for before this one is handed
 * over, so PostgreSQL computes it while Node works on this one. Closing the generator early (or an error)
 * waits for the batch in flight and closes the cursor. Shared by the cohort scan and the export scan.
 */
export async function* cursorBatches<R>(cursor: Cursor<R>, size: number): AsyncGenerator<R[]> {
  let next: Promise<R[]> | null = cursor.read(size);
  try {
    for (;;) {
      const rows: R[] = await next;
      next = null;
      if (rows.length === 0) return;
      next = cursor.read(size);
      yield rows;
    }
  } finally {
    if (next) await next.catch(() => undefined);
    await cursor.close();
  }
}
