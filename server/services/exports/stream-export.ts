import { createHash } from 'node:crypto';
import { Readable, Transform, type Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { stringify } from 'csv-stringify/sync';
import type { ExportStatus } from '../../../shared/export-columns';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { exportLog } from '../../db/schema';
import { audit } from '../audit';
import { currentRules } from '../rules.service';
import { criteriaSteps, firstFailure, needsScores } from '../cohorts/criteria';
import { deriveContext } from '../cohorts/derive';
import { loadReference } from '../cohorts/reference';
import { scanFacts, withSnapshot } from '../cohorts/scan';
import { authoriseDownload, type DownloadGrant } from './data-requests.service';
import { columnsFor, groupsNeedScores } from './columns';
import { generalise, planGeneralisation, qiKey, type Plan, type Qi } from './generalise';
import { clinicCoder, qiOf, recordBuilder } from './row';
import type { Cell } from './csv-cell';

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

/** Rows per csv-stringify call (and per chunk written to the response). */
const CHUNK_ROWS = 128;

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
 * pass 1 counts the quasi-identifier combinations of the cohort (one number per combination) and plans the
 * k-anonymity generalisation; pass 2 streams the rows from a cursor through csv-stringify (one call per chunk of
 * rows) and a hashing tap into the response with stream.pipeline (backpressure from the socket back to the cursor).
 * The audit event (rows, SHA-256 of the bytes sent) is written before the response ends; an abandoned download
 * is audited as aborted.
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
  const p: Progress = {
    rows: 0,
    bytes: 0,
    hash: createHash('sha256'),
    plan: null,
    startedAt: new Date(),
    recorded: false,
  };
  try {
    await withSnapshot(db, async (client) => {
      const counts = new Map<string, { qi: Qi; n: number }>();
      for await (const batch of scanFacts(client, ctx, { scores: needsScores(grant.criteria) })) {
        for (const f of batch) {
          if (firstFailure(steps, f) >= 0) continue;
          const qi = qiOf(f, grant.startGranularity);
          const key = qiKey(qi);
          const c = counts.get(key);
          if (c) c.n++;
          else counts.set(key, { qi, n: 1 });
        }
      }
      const plan = planGeneralisation(counts, grant.k);
      p.plan = plan;
      sink.begin({
        exportName: `loadline-request-${grant.requestId}`,
        expectedRows: plan.keptRows,
        generalisedRows: plan.generalisedRows,
        suppressedRows: plan.suppressedRows,
        k: grant.k,
      });

      const build = recordBuilder(columns, clinicCoder());
      const names = columns.map((c) => c.name);
      const scores = needsScores(grant.criteria) || groupsNeedScores(grant.variableGroups);
      // One csv-stringify call per chunk of rows; the generator is only resumed when the response has room,
      // so pipeline backpressure reaches back to the cursor.
      async function* csvChunks() {
        let header = true;
        let records: Cell[][] = [];
        const chunk = () => {
          const text = stringify(records, { header, columns: names });
          p.rows += records.length;
          records = [];
          header = false;
          return text;
        };
        for await (const batch of scanFacts(client, ctx, { scores })) {
          for (const f of batch) {
            if (firstFailure(steps, f) >= 0) continue;
            const qi = qiOf(f, grant.startGranularity);
            const level = plan.decision.get(qiKey(qi));
            if (level === undefined || level === 'suppress') continue;
            records.push(build(f, generalise(qi, level)));
            // Small chunks keep what is alive at any moment small, so memory stays flat.
            if (records.length === CHUNK_ROWS) yield chunk();
          }
        }
        if (records.length > 0 || header) yield chunk();
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
