import { createHash } from 'node:crypto';
import { desc, eq, sql } from 'drizzle-orm';
import type pg from 'pg';
import type { UploadRecord, UploadResult } from '../../shared/schemas/upload';
import type { Db } from '../db/client';
import { withClientTransaction } from '../db/client-transaction';
import type { Scope } from '../db/scope';
import { uploads } from '../db/schema';
import { ForbiddenError, HttpError } from '../errors';
import { audit, type Tx } from './audit';
import { assertClinicAccepts } from './clinics.service';
import { writableClinic } from './episodes-scope';
import { loadReferenceData } from './reference.service';
import { decodeUpload } from './uploads-decode';
import { IssueLog, UploadRejected } from './uploads-issues';
import { NotGrouped, readStreamed, readWhole, type Outcome } from './uploads-run';

export type UploadFile = { buffer: Buffer; originalname: string };
export type UploadAnswer = { status: 200 | 422; body: UploadResult & { error?: { message: string } } };

/** Uploads of one clinic never run at the same time (the second waits): each sees the other's rows. */
const UPLOAD_LOCK = 0x4c4c5550;
/** New rows from which a commit refreshes the planner statistics of the tables it grew. */
const ANALYZE_AFTER = 10_000;

/**
 * Fresh planner statistics after a large upload. These tables have no foreign keys (drizzle/0012_ref_triggers.sql),
 * which the planner would otherwise use to size their joins; with statistics from before tens of thousands of new
 * rows it can choose nested loops over whole tables until autovacuum analyzes them. After the commit (inside the
 * transaction it took 1 s, the new rows being its own) and before answering, so the next request is planned with
 * them. What the planner lacked is the tables' sizes and rough distributions, so a sample of 7,500 rows a table
 * (statistics target 25 instead of 100) does: measured on the 100,000-row bench, 0.08-0.18 s instead of 0.27 s; the
 * next autovacuum analyze takes the full sample. A failure changes nothing committed: autovacuum redoes it later.
 */
async function refreshStatistics(db: Db): Promise<void> {
  await db
    .transaction(async (tx) => {
      await tx.execute(sql`set local default_statistics_target = 25`);
      await tx.execute(sql`analyze episode, assessment, score, episode_intervention`);
    })
    .catch(() => undefined);
}

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
  try {
    const ref = await loadReferenceData(db);
    const text = decodeUpload(file.buffer);
    // Read as it is written when the file's rows come episode by episode, else whole first (see uploads-run.ts).
    const check = async (tx: Tx, client: pg.PoolClient | null, streamed: boolean): Promise<Outcome> => {
      const log = new IssueLog();
      const ctx = { clinicId, userId: scope.userId, ref, log };
      const outcome = (streamed ? await readStreamed(tx, client, ctx, text) : null) ?? (await readWhole(tx, client, ctx, text));
      if (log.total > 0) {
        const { rows, summary } = outcome;
        const rejected = new Set([...log.rejectedRows, ...summary.rejectedRows]).size;
        const message = `${rejected.toLocaleString('en')} of ${rows.toLocaleString('en')} rows have problems; nothing was saved`;
        throw new Refused(refused(dryRun, rows - rejected, rejected, log, message));
      }
      return outcome;
    };
    const ok = ({ rows, summary }: Outcome, uploadId: number | null): UploadAnswer => ({
      status: 200,
      body: { dryRun, accepted: rows, rejected: 0, errors: [], truncated: false, changes: summary.changes, uploadId },
    });
    const scattered = (e: unknown): null => {
      if (e instanceof NotGrouped) return null;
      throw e;
    };
    if (dryRun) return ok((await check(db, null, true).catch(scattered)) ?? (await check(db, null, false)), null);

    const sha = createHash('sha256').update(file.buffer).digest('hex');
    const fileName = file.originalname.replace(/^.*[\\/]/, '').slice(0, 120) || 'upload.csv';
    // A scattered file found out midway is committed by a second transaction; the first one's writes roll back.
    const commit = (streamed: boolean) =>
      withClientTransaction(db, async (client, tx) => {
        await tx.execute(sql`select pg_advisory_xact_lock(${UPLOAD_LOCK}::int, ${clinicId}::int)`);
        // Array parameters hide their length from the planner, whose guesses then make JIT compile each big
        // statement (most of a second each, longer than the statement's own work).
        await tx.execute(sql`select set_config('jit', 'off', true)`);
        await assertClinicAccepts(tx, clinicId); // a deactivated clinic accepts nothing new
        const outcome = await check(tx, client, streamed);
        const { rows, summary } = outcome;
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
        return ok(outcome, u!.id);
      });
    const answer = (await commit(true).catch(scattered)) ?? (await commit(false));
    const c = answer.body.changes;
    if (c && c.episodesCreated + c.assessmentsCreated >= ANALYZE_AFTER) await refreshStatistics(db);
    return answer;
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
