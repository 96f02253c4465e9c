import { createHash } from 'node:crypto';
import { Readable, Transform, type Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { ExportStatus } from '../../../shared/export-columns';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { exportLog } from '../../db/schema';
import { audit } from '../audit';
import { currentRules } from '../rules.service';
import { criteriaSteps, needsScores } from '../cohorts/criteria';
import { deriveContext, deriveFacts } from '../cohorts/derive';
import { loadReference } from '../cohorts/reference';
import { withSnapshot } from '../cohorts/scan';
import { authoriseDownload, type DownloadGrant } from './data-requests.service';
import { columnsFor, groupsNeedScores } from './columns';
import { headerLine } from './csv-cell';
import { countCohort, verdictOf } from './export-plan';
import { scanExportRows } from './export-scan';
import type { Plan } from './generalise';
import { lineBuilder } from './csv-line';
import { clinicCoder } from './row';

export type ExportMeta = {
  exportName: string;
  expectedRows: number;
  generalisedRows: number;
  suppressedRows: number;
  k: number;
};
export type ExportSink = { out: Writable; begin(meta: ExportMeta): void };

type Progress = {
  rows: number;
  bytes: number;
  hash: ReturnType<typeof createHash>;
  plan: Plan | null;
  startedAt: Date;
  recorded: boolean;
};

/** Rows per chunk written to the response (about 100 kB): few enough writes, little alive at any moment. */
const CHUNK_ROWS = 512;

const ABORT_CODES = new Set(['ERR_STREAM_PREMATURE_CLOSE', 'ECONNRESET', 'EPIPE', 'ERR_STREAM_DESTROYED']);

async function record(db: Db, grant: DownloadGrant, p: Progress, status: ExportStatus): Promise<void> {
  if (p.recorded) return;
  p.recorded = true;
  const sha256 = p.hash.digest('hex');
  await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(exportLog)
      .values({
        requestId: grant.requestId,
        userId: grant.userId,
        status,
        rowCount: p.rows,
        generalisedRows: p.plan?.generalisedRows ?? 0,
        suppressedRows: p.plan?.suppressedRows ?? 0,
        k: grant.k,
        byteCount: p.bytes,
        sha256,
        startedAt: p.startedAt,
      })
      .returning({ id: exportLog.id });
    await audit(tx, {
      actorId: grant.userId,
      clinicId: null,
      action: 'export',
      entity: 'data_request',
      entityId: grant.requestId,
      detail: {
        exportId: row!.id,
        status,
        rowCount: p.rows,
        sha256,
        byteCount: p.bytes,
        k: grant.k,
        generalisedRows: p.plan?.generalisedRows ?? 0,
        suppressedRows: p.plan?.suppressedRows ?? 0,
      },
    });
  });
}

/**
 * Streams the de-identified CSV of an approved request into `sink.out` in two passes over one snapshot:
 * pass 1 counts the quasi-identifier combinations of the cohort (one number per combination; it reads scores
 * and interventions only when the criteria need them) and plans the k-anonymity generalisation; pass 2 streams
 * the rows from a cursor, each formatted into its CSV line by formatters compiled once per export (text encoded
 * by csv-stringify once per distinct value), through a hashing tap into the response with stream.pipeline
 * (backpressure from the socket back to the cursor). The audit event (rows, SHA-256 of the bytes sent) is
 * written before the response ends; an abandoned download is audited as aborted.
 */
export async function streamExport(
  db: Db,
  scope: Scope,
  requestId: number,
  sink: ExportSink,
  log: (m: string) => void,
): Promise<void> {
  const grant = await authoriseDownload(db, scope, requestId);
  const [ref, { rules }] = await Promise.all([loadReference(db), currentRules(db)]);
  const columns = columnsFor(ref, rules, grant);
  const steps = criteriaSteps(grant.criteria);
  const ctx = deriveContext(ref, rules);
  const granularity = grant.startGranularity;
  const p: Progress = {
    rows: 0,
    bytes: 0,
    hash: createHash('sha256'),
    plan: null,
    startedAt: new Date(),
    recorded: false,
  };
  const countNeeds = { scores: needsScores(grant.criteria), interventions: grant.criteria.addOns !== null };
  const fileNeeds = {
    scores: countNeeds.scores || groupsNeedScores(grant.variableGroups),
    interventions: countNeeds.interventions || columns.some((c) => c.source.kind === 'intervention'),
  };
  try {
    await withSnapshot(db, async (client) => {
      const verdict = await countCohort(client, ctx, { steps, granularity, needs: countNeeds, k: grant.k });
      const plan = verdict.plan;
      p.plan = plan;
      sink.begin({
        exportName: `loadline-request-${grant.requestId}`,
        expectedRows: plan.keptRows,
        generalisedRows: plan.generalisedRows,
        suppressedRows: plan.suppressedRows,
        k: grant.k,
      });

      const line = lineBuilder(columns, clinicCoder());
      const header = `${headerLine(columns.map((c) => c.name))}\n`;
      // One string per chunk of rows; the generator is only resumed when the response has room, so pipeline
      // backpressure reaches back to the cursor.
      async function* csvChunks() {
        let text = header;
        let rows = 0;
        let ordinal = 0;
        for await (const batch of scanExportRows(client, fileNeeds)) {
          for (const row of batch) {
            const q = verdictOf(verdict, ordinal++, row.id);
            if (!q) continue; // outside the cohort, or suppressed
            text += `${line(deriveFacts(row, ctx), q)}\n`;
            if (++rows === CHUNK_ROWS) {
              p.rows += rows;
              yield text;
              text = '';
              rows = 0;
            }
          }
        }
        p.rows += rows;
        if (text.length > 0) yield text;
      }
      const tap = new Transform({
        transform(chunk: Buffer, _enc, done) {
          p.hash.update(chunk);
          p.bytes += chunk.length;
          done(null, chunk);
        },
        // Every byte has passed: audit now, so the response only ends once the export is on record.
        flush(done) {
          if (sink.out.destroyed) return done(); // the client left: the pipeline fails and audits the abort
          record(db, grant, p, 'completed').then(() => done(), done);
        },
      });
      await pipeline(Readable.from(csvChunks(), { objectMode: true, highWaterMark: 1 }), tap, sink.out);
    });
  } catch (e) {
    const code = (e as { code?: string }).code;
    const aborted = code !== undefined && ABORT_CODES.has(code);
    const status: ExportStatus = aborted ? 'aborted' : 'failed';
    await record(db, grant, p, status).catch((err: unknown) =>
      log(`export: could not audit the ${status} export of request ${grant.requestId}: ${String(err)}`),
    );
    if (aborted) return;
    throw e;
  }
}
