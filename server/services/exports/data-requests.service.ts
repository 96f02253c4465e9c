import { and, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { CohortCriteriaSchema, type CohortCriteria } from '../../../shared/schemas/cohort';
import type { DataRequest, DataRequestApprove, DataRequestCreate } from '../../../shared/schemas/data-request';
import type { VariableGroup } from '../../../shared/export-columns';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { cohorts, cohortVersions, dataRequests, exportLog, users } from '../../db/schema';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../../errors';
import type { Mailer } from '../../mail/transport';
import { sendOrLog } from '../../mail/send';
import { audit } from '../audit';
import { currentRules } from '../rules.service';
import { assertRegistry, assertResearcher, assertSteward } from '../cohorts/access';
import { decisionMail, type Decision } from './request-mail';

export type MailDeps = { mailer: Mailer; log: (m: string) => void };
type Row = Awaited<ReturnType<typeof selectRequests>>[number];

/** Dates are compared as calendar days in UTC: a request is downloadable through its expiry day. */
export const todayIso = () => new Date().toISOString().slice(0, 10);

const requester = alias(users, 'requester');

function selectRequests(db: Db, where: SQL | undefined) {
  return db
    .select({
      request: dataRequests,
      version: cohortVersions,
      cohortName: cohorts.name,
      cohortId: cohorts.id,
      requester,
    })
    .from(dataRequests)
    .innerJoin(cohortVersions, eq(cohortVersions.id, dataRequests.cohortVersionId))
    .innerJoin(cohorts, eq(cohorts.id, cohortVersions.cohortId))
    .innerJoin(requester, eq(requester.id, dataRequests.requesterId))
    .where(where)
    .orderBy(desc(dataRequests.createdAt), desc(dataRequests.id));
}

const isDownloadable = (r: Row['request'], userId: number) =>
  r.status === 'approved' && r.requesterId === userId && r.expiresOn !== null && r.expiresOn >= todayIso();

async function present(db: Db, scope: Extract<Scope, { kind: 'registry' }>, rows: Row[]): Promise<DataRequest[]> {
  const ids = rows.map((r) => r.request.id);
  const logs = ids.length
    ? await db.select().from(exportLog).where(inArray(exportLog.requestId, ids)).orderBy(desc(exportLog.finishedAt))
    : [];
  return rows.map((r) => ({
    id: r.request.id,
    cohortId: r.cohortId,
    cohortName: r.cohortName,
    cohortVersion: r.version.version,
    requester: { id: r.requester.id, name: r.requester.name, email: r.requester.email },
    mine: r.request.requesterId === scope.userId,
    purpose: r.request.purpose,
    variableGroups: ['core', ...r.request.variableGroups] as VariableGroup[],
    status: r.request.status,
    decidedAt: r.request.decidedAt?.toISOString() ?? null,
    declineReason: r.request.declineReason,
    expiresOn: r.request.expiresOn,
    startGranularity: r.request.startGranularity,
    allowRawBmi: r.request.allowRawBmi,
    k: r.request.k,
    downloadable: isDownloadable(r.request, scope.userId),
    createdAt: r.request.createdAt.toISOString(),
    exports: logs
      .filter((l) => l.requestId === r.request.id)
      .map((l) => ({
        id: l.id,
        status: l.status,
        rowCount: l.rowCount,
        generalisedRows: l.generalisedRows,
        suppressedRows: l.suppressedRows,
        finishedAt: l.finishedAt.toISOString(),
      })),
  }));
}

/** A researcher's own requests; the steward sees every request (the approval queue). */
export async function listDataRequests(db: Db, scope: Scope): Promise<{ items: DataRequest[]; total: number }> {
  assertRegistry(scope);
  const rows = await selectRequests(db, scope.researcher ? eq(dataRequests.requesterId, scope.userId) : undefined);
  const items = await present(db, scope, rows);
  return { items, total: items.length };
}

async function one(db: Db, scope: Extract<Scope, { kind: 'registry' }>, id: number): Promise<DataRequest> {
  const rows = await selectRequests(db, eq(dataRequests.id, id));
  const [item] = await present(db, scope, rows);
  if (!item) throw new NotFoundError('No such data request');
  return item;
}

/** Turns the current version of one of the researcher's saved cohorts into a pending request. */
export async function createDataRequest(db: Db, scope: Scope, input: DataRequestCreate): Promise<DataRequest> {
  assertResearcher(scope);
  const [cohort] = await db
    .select({ versionId: cohortVersions.id, ownerId: cohorts.ownerId })
    .from(cohorts)
    .innerJoin(
      cohortVersions,
      and(eq(cohortVersions.cohortId, cohorts.id), eq(cohortVersions.version, cohorts.currentVersion)),
    )
    .where(eq(cohorts.id, input.cohortId));
  if (!cohort || cohort.ownerId !== scope.userId) throw new NotFoundError('No such saved cohort of yours');
  const id = await db.transaction(async (tx) => {
    const [r] = await tx
      .insert(dataRequests)
      .values({
        cohortVersionId: cohort.versionId,
        requesterId: scope.userId,
        purpose: input.purpose,
        variableGroups: input.variableGroups as VariableGroup[],
      })
      .returning({ id: dataRequests.id });
    await audit(tx, {
      actorId: scope.userId,
      clinicId: null,
      action: 'create',
      entity: 'data_request',
      entityId: r!.id,
      detail: { cohortId: input.cohortId, variableGroups: input.variableGroups },
    });
    return r!.id;
  });
  return one(db, scope, id);
}

/** Records the steward's decision (pending requests only), then tells both sides by e-mail. */
async function decide(db: Db, scope: Scope, id: number, d: Decision, deps: MailDeps): Promise<DataRequest> {
  assertSteward(scope);
  const [steward] = await db.select({ email: users.email }).from(users).where(eq(users.id, scope.userId));
  const updated = await db.transaction(async (tx) => {
    const [locked] = await tx.select().from(dataRequests).where(eq(dataRequests.id, id)).for('update');
    if (!locked) throw new NotFoundError('No such data request');
    if (locked.status !== 'pending') throw new ConflictError(`This request was already ${locked.status}`);
    const values =
      d.kind === 'approved'
        ? {
            status: 'approved' as const,
            expiresOn: d.expiresOn,
            startGranularity: d.startGranularity as 'year' | 'quarter',
            allowRawBmi: d.allowRawBmi,
            k: d.k,
          }
        : { status: 'declined' as const, declineReason: d.reason };
    await tx
      .update(dataRequests)
      .set({ ...values, decidedBy: scope.userId, decidedAt: sql`now()` })
      .where(eq(dataRequests.id, id));
    await audit(tx, {
      actorId: scope.userId,
      clinicId: null,
      action: d.kind === 'approved' ? 'approve' : 'decline',
      entity: 'data_request',
      entityId: id,
      detail: { ...d },
    });
    return locked;
  });
  const item = await one(db, scope, id);
  // The decision is saved; a failed e-mail is logged and never undoes it.
  for (const to of new Set([item.requester.email, steward?.email].filter((e): e is string => Boolean(e)))) {
    await sendOrLog(deps.mailer, decisionMail(to, updated.id, item.cohortName, d), `data request ${d.kind}`, deps.log);
  }
  return item;
}

export async function approveDataRequest(db: Db, scope: Scope, id: number, input: DataRequestApprove, deps: MailDeps) {
  assertSteward(scope);
  if (input.expiresOn < todayIso()) {
    throw new ValidationError('The expiry date has already passed', [
      { path: ['expiresOn'], message: 'Choose today or a later day' },
    ]);
  }
  const k = input.k ?? (await currentRules(db)).rules.exportK;
  return decide(
    db,
    scope,
    id,
    {
      kind: 'approved',
      expiresOn: input.expiresOn,
      startGranularity: input.startGranularity,
      allowRawBmi: input.allowRawBmi,
      k,
    },
    deps,
  );
}

export async function declineDataRequest(db: Db, scope: Scope, id: number, reason: string, deps: MailDeps) {
  return decide(db, scope, id, { kind: 'declined', reason }, deps);
}

export type DownloadGrant = {
  requestId: number;
  userId: number;
  criteria: CohortCriteria;
  variableGroups: VariableGroup[];
  startGranularity: 'year' | 'quarter';
  allowRawBmi: boolean;
  k: number;
};

/** Only the requester, only once approved, only up to the expiry day: everyone else gets 403. */
export async function authoriseDownload(db: Db, scope: Scope, id: number): Promise<DownloadGrant> {
  assertResearcher(scope);
  const [row] = await selectRequests(db, eq(dataRequests.id, id));
  if (!row) throw new NotFoundError('No such data request');
  const r = row.request;
  if (r.requesterId !== scope.userId)
    throw new ForbiddenError('Only the researcher who made this request can download it');
  if (r.status !== 'approved') throw new ForbiddenError('This request has not been approved');
  if (!isDownloadable(r, scope.userId)) throw new ForbiddenError(`This request expired on ${r.expiresOn}`);
  return {
    requestId: r.id,
    userId: scope.userId,
    criteria: CohortCriteriaSchema.parse(row.version.criteria),
    variableGroups: r.variableGroups,
    startGranularity: r.startGranularity ?? 'year',
    allowRawBmi: r.allowRawBmi,
    k: Math.max(3, r.k ?? 5),
  };
}
