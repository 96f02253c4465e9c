import type pg from 'pg';
import type { Tx } from './audit';
import type { ReferenceData } from './reference.service';
import { UploadSummary } from './uploads-audit';
import { loadStoredEpisodes } from './uploads-existing';
import type { IssueLog } from './uploads-issues';
import type { Header } from './uploads-parse';
import { planUpload, type Plan } from './uploads-plan';
import type { RowStore } from './uploads-rows';
import type { ReadEpisode, UploadEpisode } from './uploads-validate';
import { IdPool } from './uploads-ids';
import { prepareWrite, type PreparedWrite } from './uploads-write';

/** Episodes planned between two turns of the event loop. */
const PLAN_SLICE = 100;
/** A turn of the event loop: lets pg send the next statement of a write in flight, and read its replies. */
export const turn = () => new Promise<void>((resolve) => setImmediate(resolve));

export type RunContext = { clinicId: number; userId: number | null; ref: ReferenceData; log: IssueLog };

/**
 * Checks chunks of complete episodes against what is stored and (with a `client`, i.e. in a commit) writes each
 * chunk while nothing is wrong; the caller's transaction undoes it all if a later chunk has a problem.
 * A pipeline on the one connection of the transaction (which takes one query at a time): `add` reads the
 * chunk's stored rows and reserves its ids, then starts writing the chunk before it, then plans the chunk and
 * makes its COPY text while that write runs (and the caller reads the next rows). Chunks never share an episode,
 * so a chunk's stored rows are the same read before or after the previous chunk is written.
 */
export class ChunkWriter {
  readonly summary = new UploadSummary();
  private writing: Promise<unknown> = Promise.resolve();
  private next: PreparedWrite | undefined;
  private readonly ids = new IdPool();

  constructor(
    private readonly tx: Tx,
    private readonly client: pg.PoolClient | null,
    private readonly ctx: RunContext,
    private readonly header: Header,
    private readonly store: () => RowStore | undefined,
  ) {}

  async add(chunk: ReadEpisode[]): Promise<void> {
    if (chunk.length === 0) return;
    const { clinicId, userId, ref, log } = this.ctx;
    await this.writing;
    const stored = await loadStoredEpisodes(this.tx, clinicId, chunk.map((g) => g.reference));
    if (this.client) await this.ids.ensure(this.tx, chunk.length, chunk.reduce((n, g) => n + (g.rows?.length ?? g.rowIds.length), 0));
    this.start();
    // Planned a slice at a time, with a turn of the event loop between: the write just started is several
    // statements, and the next one is only sent when Node looks up from its work.
    const rows = this.store();
    const all: Plan = { episodes: [], assessments: [], rowsUnchanged: 0, rejectedRows: new Set() };
    for (let i = 0; i < chunk.length; i += PLAN_SLICE) {
      if (i > 0) await turn();
      const part: UploadEpisode[] = chunk
        .slice(i, i + PLAN_SLICE)
        .map(({ rawCells: _, rowIds, rows: kept, ...g }) => ({ ...g, rows: kept ?? rowIds.map((k) => rows!.row(k)) }));
      log.planning = true;
      const plan = planUpload(part, stored, ref, this.header, log);
      log.planning = false;
      this.summary.add(plan);
      all.episodes.push(...plan.episodes);
      all.assessments.push(...plan.assessments);
    }
    await turn();
    if (this.client && log.total === 0) this.next = prepareWrite(clinicId, userId, all, ref, this.ids);
  }

  /** Writes the last chunk; the summary is then complete. */
  async finish(): Promise<UploadSummary> {
    await this.writing;
    this.start();
    await this.writing;
    return this.summary;
  }

  /** Leaving early: never leave a statement running, or its failure unobserved. */
  async abandon(): Promise<void> {
    await this.writing.catch(() => undefined);
  }

  /** Starts writing the prepared chunk, unless a problem has been found meanwhile (then nothing more is written). */
  private start(): void {
    const prepared = this.next;
    this.next = undefined;
    if (!prepared || !this.client || this.ctx.log.total > 0) return;
    this.writing = prepared.run(this.tx, this.client);
    // Observed at once: the event loop turns many times before the next `await this.writing` reports a failure,
    // and a rejection nobody handles by then would end the process.
    this.writing.catch(() => undefined);
  }
}
