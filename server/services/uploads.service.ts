import { createHash } from 'node:crypto';
import { desc, eq, sql } from 'drizzle-orm';
import type { UploadRecord, UploadResult } from '../../shared/schemas/upload';
import type { Db } from '../db/client';
import type { Scope } from '../db/scope';
import { uploads } from '../db/schema';
import { ForbiddenError, HttpError } from '../errors';
import { audit, type Tx } from './audit';
import { assertClinicAccepts } from './clinics.service';
import { writableClinic } from './episodes-scope';
import { loadReferenceData } from './reference.service';
import type { UploadSummary } from './uploads-audit';
import { IssueLog, UploadRejected } from './uploads-issues';
import { checkAndWrite, readUpload } from './uploads-run';

export type UploadFile = { buffer: Buffer; originalname: string };
export type UploadAnswer = { status: 200 | 422; body: UploadResult & { error?: { message: string } } };

/** Uploads of one clinic never run at the same time (the second waits): each sees the other's rows. */
const UPLOAD_LOCK = 0x4c4c5550;

function refused(dryRun: boolean, accepted: number, rejected: number, log: { issues: UploadResult['errors']; truncated: boolean }, message: string): UploadAnswer {
  return {
    status: 422,
    body: { dryRun, accepted, rejected, errors: log.issues, truncated: log.truncated, changes: null, uploadId: null, error: { message } },
  };
}

class Refused extends Error {
  constructor(readonly answer: UploadAnswer) {
    super('upload refused');
  }
}

/**
 * Checks (dry run) or commits a CSV of assessments. A dry run writes nothing at all. A commit writes
 * everything in one transaction, or nothing when any row has a problem. Re-sending a file changes no
 * episode data (rows match by clinic + episode reference + date + timepoint); a corrected file updates in place.
 */
export async function uploadEpisodes(db: Db, scope: Scope, file: UploadFile, dryRun: boolean): Promise<UploadAnswer> {
  const clinicId = writableClinic(scope);
  const log = new IssueLog();
  try {
    const ref = await loadReferenceData(db);
    const read = readUpload(file.buffer, log, ref);
    const { rows } = read;
    const ctx = { clinicId, userId: scope.userId, ref, log };
    const run = async (tx: Tx, write: boolean): Promise<UploadSummary> => {
      const summary = await checkAndWrite(tx, ctx, read, write);
      if (log.total > 0) {
        const rejected = new Set([...log.rejectedRows, ...summary.rejectedRows]).size;
        const message = `${rejected.toLocaleString('en')} of ${rows.toLocaleString('en')} rows have problems; nothing was saved`;
        throw new Refused(refused(dryRun, rows - rejected, rejected, log, message));
      }
      return summary;
    };
    const ok = (summary: UploadSummary, uploadId: number | null): UploadAnswer => ({
      status: 200,
      body: { dryRun, accepted: rows, rejected: 0, errors: [], truncated: false, changes: summary.changes, uploadId },
    });
    if (dryRun) return ok(await run(db, false), null);

    const sha = createHash('sha256').update(file.buffer).digest('hex');
    const fileName = file.originalname.replace(/^.*[\\/]/, '').slice(0, 120) || 'upload.csv';
    return await db.transaction(async (tx) => {
      await tx.execute(sql`select pg_advisory_xact_lock(${UPLOAD_LOCK}::int, ${clinicId}::int)`);
      // Array parameters hide their length from the planner, whose guesses then make JIT compile each big
      // statement (most of a second each, longer than the statement's own work).
      await tx.execute(sql`select set_config('jit', 'off', true)`);
      await assertClinicAccepts(tx, clinicId); // a deactivated clinic accepts nothing new
      const summary = await run(tx, true);
      const [u] = await tx
        .insert(uploads)
        .values({ clinicId, userId: scope.userId, fileName, fileSha256: sha, rowCount: rows, accepted: rows, rejected: 0, status: 'committed' })
        .returning({ id: uploads.id });
      await audit(tx, {
        actorId: scope.userId,
        clinicId,
        action: 'upload',
        entity: 'upload',
        entityId: u!.id,
        detail: { fileName, fileSha256: sha, rows, ...summary.detail() },
      });
      return ok(summary, u!.id);
    });
  } catch (e) {
    if (e instanceof Refused) return e.answer;
    if (e instanceof UploadRejected) {
      if (e.status === 413) throw new HttpError(413, e.message, e.issues);
      return refused(dryRun, 0, 0, { issues: e.issues, truncated: false }, e.message);
    }
    throw e;
  }
}

/** The committed uploads of the caller's clinic (the steward sees every clinic's), newest first. */
export async function listUploads(db: Db, scope: Scope, q: { limit: number; offset: number }): Promise<{ items: UploadRecord[]; total: number }> {
  if (scope.kind === 'registry' && scope.researcher) throw new ForbiddenError('Researchers do not see clinics’ uploads');
  const where = scope.kind === 'clinic' ? eq(uploads.clinicId, scope.clinicId) : undefined;
  const [rows, [count]] = await Promise.all([
    db.select().from(uploads).where(where).orderBy(desc(uploads.id)).limit(q.limit).offset(q.offset),
    db.select({ n: sql<number>`count(*)::int` }).from(uploads).where(where),
  ]);
  return {
    items: rows.map((r) => ({
      id: r.id,
      clinicId: r.clinicId,
      fileName: r.fileName,
      rowCount: r.rowCount,
      accepted: r.accepted,
      rejected: r.rejected,
      status: r.status,
      createdAt: r.createdAt.toISOString(),
    })),
    total: count?.n ?? 0,
  };
}
