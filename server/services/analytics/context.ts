import { asc, eq } from 'drizzle-orm';
import type { RecoveryRule } from '../../../analysis/index';
import type { Role } from '../../../shared/roles';
import type { AnalyticsFilters } from '../../../shared/schemas/analytics-filters';
import type { AnalyticsMeta, InstrumentInfo } from '../../../shared/schemas/analytics';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { clinics, conditions, instruments, users } from '../../db/schema';
import { ForbiddenError, NotFoundError, ValidationError } from '../../errors';
import { currentRules, type VersionedRules } from '../rules.service';

export type Instrument = InstrumentInfo & { id: number };

/**
 * Who is asking and about whom: the subject (one clinic or the registry), the registry-wide comparison
 * cohort, and the reference data every analytics computation needs. Built once per cache miss.
 */
export type AnalyticsContext = {
  role: Role;
  filters: AnalyticsFilters;
  rules: VersionedRules;
  rulesSetBy: string | null;
  instruments: Instrument[];
  instrument: Instrument;
  recoveryInstrument: Instrument;
  recoveryRule: RecoveryRule;
  /** The clinic the numbers describe, or null for the registry as a whole. */
  subjectClinic: { id: number; code: string; name: string } | null;
  /** Researchers see consenting episodes only. */
  consentingOnly: boolean;
  conditions: { code: string; label: string }[];
  /** Every clinic; internal (names reach only the steward, through clinicOptions and the peer comparison). */
  allClinics: ClinicRef[];
  /** The steward's clinic picker; empty for every other role. */
  clinicOptions: ClinicRef[];
};

type ClinicRef = { id: number; code: string; name: string; active: boolean };

/** Which clinic a request may look at (data-access rule: the only place the analytics pick a clinic). */
export function subjectClinicId(scope: Scope, filters: AnalyticsFilters): number | null {
  if (scope.kind === 'clinic') {
    if (filters.clinic === undefined) return scope.clinicId;
    if (filters.clinic === 'registry') return null;
    if (filters.clinic !== scope.clinicId)
      throw new ForbiddenError('You can see your own clinic and the registry as a whole');
    return scope.clinicId;
  }
  if (scope.researcher) {
    if (filters.clinic !== undefined && filters.clinic !== 'registry') {
      throw new ForbiddenError('Research access covers the registry as a whole, not single clinics');
    }
    return null;
  }
  return filters.clinic === undefined || filters.clinic === 'registry' ? null : filters.clinic;
}

function instrumentInfo(row: typeof instruments.$inferSelect): Instrument {
  const { id, code, label, unit, min, max, higherIsBetter, mcid, mcidSource } = row;
  return { id, code, label, unit, min, max, higherIsBetter, mcid, mcidSource };
}

export async function buildContext(
  db: Db,
  scope: Scope,
  role: Role,
  filters: AnalyticsFilters,
): Promise<AnalyticsContext> {
  const clinicId = subjectClinicId(scope, filters);
  const [rules, instrumentRows, conditionRows, clinicRows] = await Promise.all([
    currentRules(db),
    db.select().from(instruments).orderBy(asc(instruments.id)),
    db.select({ code: conditions.code, label: conditions.label }).from(conditions).orderBy(asc(conditions.label)),
    db
      .select({ id: clinics.id, code: clinics.code, name: clinics.displayName, active: clinics.active })
      .from(clinics)
      .orderBy(asc(clinics.code)),
  ]);
  const all = instrumentRows.map(instrumentInfo);
  const instrument = all.find((i) => i.code === filters.instrument);
  if (!instrument)
    throw new ValidationError('Unknown instrument', [
      { path: ['instrument'], message: `No instrument "${filters.instrument}"` },
    ]);
  if (filters.condition && !conditionRows.some((c) => c.code === filters.condition)) {
    throw new ValidationError('Unknown condition', [
      { path: ['condition'], message: `No condition "${filters.condition}"` },
    ]);
  }
  const recoveryInstrument = all.find((i) => i.code === rules.rules.recovery.instrumentCode);
  if (!recoveryInstrument)
    throw new Error(`registry rules name an unknown recovery instrument ${rules.rules.recovery.instrumentCode}`);
  const subject = clinicId === null ? null : clinicRows.find((c) => c.id === clinicId);
  if (subject === undefined) throw new NotFoundError('No such clinic');
  let rulesSetBy: string | null = null;
  if (rules.changedBy !== null) {
    const [u] = await db
      .select({ name: users.name, email: users.email })
      .from(users)
      .where(eq(users.id, rules.changedBy));
    rulesSetBy = u ? u.name || u.email : null;
  }
  return {
    role,
    filters,
    rules,
    rulesSetBy,
    instruments: all,
    instrument,
    recoveryInstrument,
    recoveryRule: {
      threshold: rules.rules.recovery.threshold,
      direction: recoveryInstrument.higherIsBetter ? 'atLeast' : 'atMost',
    },
    subjectClinic: subject ? { id: subject.id, code: subject.code, name: subject.name } : null,
    consentingOnly: scope.kind === 'registry' && scope.researcher,
    conditions: conditionRows,
    allClinics: clinicRows,
    clinicOptions: role === 'steward' ? clinicRows : [],
  };
}

/** The `meta` block of every analytics answer. */
export function metaOf(ctx: AnalyticsContext, dataVersion: number): AnalyticsMeta {
  const s = ctx.subjectClinic;
  const label = s ? (ctx.role === 'steward' ? `${s.name} (${s.code})` : `Your clinic (${s.code})`) : 'Whole registry';
  return {
    rulesVersion: ctx.rules.version,
    dataVersion,
    computedAt: new Date().toISOString(),
    viewerRole: ctx.role,
    filters: ctx.filters,
    subject: { kind: s ? 'clinic' : 'registry', clinicId: s?.id ?? null, label },
    consentingOnly: ctx.consentingOnly,
    minCellShown: ctx.consentingOnly ? ctx.rules.rules.minCellResearcher : null,
    minCellEstimate: ctx.rules.rules.minCellEstimate,
    options: {
      instruments: ctx.instruments.map((i) => ({ code: i.code, label: i.label, hasMcid: i.mcid !== null })),
      conditions: ctx.conditions,
      clinics: ctx.clinicOptions,
    },
  };
}

export function publicInstrument(i: Instrument): InstrumentInfo {
  const { id: _id, ...rest } = i;
  return rest;
}
