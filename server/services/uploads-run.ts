import type { Tx } from './audit';
import type { ReferenceData } from './reference.service';
import { UploadSummary } from './uploads-audit';
import { decodeUpload } from './uploads-decode';
import { loadStoredEpisodes } from './uploads-existing';
import type { IssueLog } from './uploads-issues';
import { parseRows, type Header } from './uploads-parse';
import { planUpload } from './uploads-plan';
import type { RowStore } from './uploads-rows';
import { RowCollector, type ReadEpisode, type UploadEpisode } from './uploads-validate';
import { writePlan } from './uploads-write';

/**
 * Episodes checked (and written) per step: bounds the memory of one step's rows, plans and statement. Speed
 * hardly depends on it (250 to 4,000 measured alike): the rows' own work in PostgreSQL dominates.
 */
const CHUNK = 1000;

export type ReadUpload = { header: Header; rows: number; groups: ReadEpisode[]; store: RowStore | undefined };

/**
 * Unpacks and reads every row into episodes. A function of its own so the unpacked bytes (about 25 MB for
 * 100,000 rows) become garbage once the rows are read, instead of living as long as the upload.
 */
export function readUpload(raw: Buffer, log: IssueLog, ref: ReferenceData): ReadUpload {
  const collector = new RowCollector(log, ref);
  const { header, rows } = parseRows(decodeUpload(raw), log, (cells, row, h) => collector.add(cells, row, h));
  const groups = [...collector.episodes.values()];
  for (const g of groups) {
    g.rawKey = ''; // only needed while reading rows
    g.rowIds = g.rowIds.slice(); // exactly as long as it is: a pushed-to array keeps room for 16
  }
  return { header, rows, groups, store: collector.store };
}

export type RunContext = { clinicId: number; userId: number | null; ref: ReferenceData; log: IssueLog };

/**
 * Checks every episode against what is stored, chunk by chunk, and (with `write`) writes each chunk while
 * nothing is wrong; the caller's transaction undoes it all if a later chunk has a problem. A chunk's statement
 * runs while the next chunk is checked; the next chunk's stored rows are read before it starts, because a
 * transaction is one connection and takes one query at a time. `file.groups` is emptied as it goes.
 */
export async function checkAndWrite(tx: Tx, ctx: RunContext, file: ReadUpload, write: boolean): Promise<UploadSummary> {
  const { clinicId, userId, ref, log } = ctx;
  const summary = new UploadSummary();
  const load = (chunk: ReadEpisode[]) => loadStoredEpisodes(tx, clinicId, chunk.map((g) => g.reference));
  const withRows = (chunk: ReadEpisode[]): UploadEpisode[] =>
    chunk.map(({ rawKey: _, rowIds, ...g }) => ({ ...g, rows: rowIds.map((i) => file.store!.row(i)) }));
  let chunk = file.groups.splice(0, CHUNK); // each chunk is garbage once planned (and written)
  let stored = await load(chunk);
  let writing: Promise<unknown> = Promise.resolve();
  try {
    while (chunk.length > 0) {
      const plan = planUpload(withRows(chunk), stored, ref, file.header, log);
      summary.add(plan);
      await writing;
      const next = file.groups.splice(0, CHUNK);
      stored = next.length > 0 ? await load(next) : new Map();
      if (write && log.total === 0) writing = writePlan(tx, clinicId, userId, plan, ref);
      chunk = next;
    }
  } finally {
    // Never leave a statement running (or its failure unobserved) when leaving early.
    await writing.catch(() => undefined);
  }
  await writing;
  return summary;
}
