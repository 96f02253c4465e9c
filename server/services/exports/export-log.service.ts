import { desc, eq } from 'drizzle-orm';
import type { ExportLogEntry } from '../../../shared/schemas/data-request';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { cohortVersions, cohorts, dataRequests, exportLog, users } from '../../db/schema';
import { assertSteward } from '../cohorts/access';

/** The steward's log of every export (completed, aborted or failed), newest first. */
export async function listExports(
  db: Db,
  scope: Scope,
  limit = 500,
): Promise<{ items: ExportLogEntry[]; total: number }> {
  assertSteward(scope);
  const rows = await db
    .select({ log: exportLog, cohortName: cohorts.name, user: { id: users.id, name: users.name, email: users.email } })
    .from(exportLog)
    .innerJoin(dataRequests, eq(dataRequests.id, exportLog.requestId))
    .innerJoin(cohortVersions, eq(cohortVersions.id, dataRequests.cohortVersionId))
    .innerJoin(cohorts, eq(cohorts.id, cohortVersions.cohortId))
    .innerJoin(users, eq(users.id, exportLog.userId))
    .orderBy(desc(exportLog.finishedAt), desc(exportLog.id))
    .limit(limit);
  const items = rows.map(({ log, cohortName, user }) => ({
    id: log.id,
    requestId: log.requestId,
    cohortName,
    user,
    status: log.status,
    rowCount: log.rowCount,
    generalisedRows: log.generalisedRows,
    suppressedRows: log.suppressedRows,
    k: log.k,
    byteCount: log.byteCount,
    sha256: log.sha256,
    startedAt: log.startedAt.toISOString(),
    finishedAt: log.finishedAt.toISOString(),
  }));
  return { items, total: items.length };
}
