import type pg from 'pg';
import type { Tx } from './audit';
import type { UploadSummary } from './uploads-audit';
import { ChunkWriter, turn, type RunContext } from './uploads-chunks';
import { csvRecords, parseRows, RowFeeder } from './uploads-parse';
import { RowCollector, type ReadEpisode } from './uploads-validate';

/**
 * Episodes checked (and written) per step: bounds the memory of one step's rows, plans and COPY text. Measured
 * on the 100,000-row bench: 1,000 beat 500 (more statements and trigger runs) and 2,000 (longer first and last
 * steps that nothing overlaps).
 */
const CHUNK = 1000;
/**
 * Rows read between two turns of the event loop while a chunk is being written: the writes are several
 * statements, and the next one can only be sent (and the reply to the last one seen) when reading pauses.
 */
const YIELD_EVERY = 25;

export type Outcome = { rows: number; summary: UploadSummary };

/** A row of an episode that was already checked (and maybe written): the file must be read whole instead. */
export class NotGrouped extends Error {
  constructor() {
    super('the rows of an episode are not together');
  }
}

/**
 * Reads the file as it checks and writes it, for the usual file whose rows come episode by episode: an episode
 * is complete once a row of another one follows, and every 1,000 complete episodes are checked against what is
 * stored, planned and written while the next rows are read, so PostgreSQL works while Node reads, and only two
 * chunks' rows are held.
 * Throws NotGrouped when an episode's rows turn up again after it was planned, since planning needs all of an
 * episode's rows (`readWhole` then does it right).
 */
export async function readStreamed(tx: Tx, client: pg.PoolClient | null, ctx: RunContext, text: Buffer): Promise<Outcome> {
  const collector = new RowCollector(ctx.log, ctx.ref, true); // rows as objects: each chunk's are garbage once written
  const planned = new Set<string>();
  let complete: string[] = [];
  let current: string | undefined;
  let refAt = -1;
  const feeder = new RowFeeder(ctx.log, (cells, row, header) => {
    if (refAt < 0) refAt = header.columns.findIndex((c) => c?.name === 'episode_reference');
    const reference = cells[refAt]!.trim();
    if (reference !== '' && reference !== current) {
      if (planned.has(reference)) throw new NotGrouped();
      if (current !== undefined) complete.push(current);
      current = reference;
    }
    collector.add(cells, row, header);
  });
  let writer: ChunkWriter | undefined;
  // The chunk handed over last goes on being checked against what is stored, planned and written while the next
  // rows are read (its queries and writes wait on PostgreSQL, and reading need not); one chunk at a time.
  let inFlight: Promise<void> = Promise.resolve();
  const handOver = async () => {
    await inFlight;
    const chunk: ReadEpisode[] = [];
    for (const reference of complete) {
      if (planned.has(reference)) continue; // an episode whose rows were split by another's, both still unplanned
      planned.add(reference);
      const group = collector.episodes.get(reference);
      if (group) chunk.push(group);
      collector.episodes.delete(reference);
    }
    complete = [];
    writer ??= new ChunkWriter(tx, client, ctx, feeder.header!, () => collector.store);
    inFlight = writer.add(chunk);
    inFlight.catch(() => undefined); // a failure is seen at the next hand-over or at the end, never unhandled
  };
  try {
    let n = 0;
    for (const [record, line] of csvRecords(text)) {
      feeder.feed(record, line);
      if (complete.length >= CHUNK) await handOver();
      else if (++n % YIELD_EVERY === 0) await turn();
    }
    if (current !== undefined) complete.push(current);
    const { rows } = feeder.finish();
    await handOver();
    await inFlight;
    return { rows, summary: await writer!.finish() };
  } finally {
    // Never leave a chunk's statements running, or their failure unobserved.
    await inFlight.catch(() => undefined);
    await writer?.abandon();
  }
}

/**
 * Reads every row into episodes first (rows may come in any order), then checks and writes them chunk by chunk.
 * Holds all rows until then (in a RowStore, about 70 bytes a row).
 */
export async function readWhole(tx: Tx, client: pg.PoolClient | null, ctx: RunContext, text: Buffer): Promise<Outcome> {
  const collector = new RowCollector(ctx.log, ctx.ref);
  const { header, rows } = parseRows(text, ctx.log, (cells, row, h) => collector.add(cells, row, h));
  const groups = [...collector.episodes.values()];
  collector.episodes.clear();
  for (const g of groups) {
    g.rawCells = null; // only needed while reading rows
    g.rowIds = g.rowIds.slice(); // exactly as long as it is: a pushed-to array keeps room for 16
  }
  const writer = new ChunkWriter(tx, client, ctx, header, () => collector.store);
  try {
    while (groups.length > 0) await writer.add(groups.splice(0, CHUNK)); // each chunk is garbage once written
    return { rows, summary: await writer.finish() };
  } finally {
    await writer.abandon();
  }
}
