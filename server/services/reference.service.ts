import { asc, eq, sql } from 'drizzle-orm';
import { PBKDF2_ITERATIONS, PSEUDONYM_ALGORITHM } from '../../shared/pseudonym';
import type { InstrumentInfo, InterventionInfo, PseudonymSalt } from '../../shared/schemas/reference';
import type { Scope } from '../db/scope';
import { clinics, conditions, instruments, interventionCodes } from '../db/schema';
import { ForbiddenError, NotFoundError } from '../errors';
import type { Tx } from './audit';

/** Every instrument, retired ones included (so stored scores can still be labelled). */
export async function listInstruments(db: Tx): Promise<InstrumentInfo[]> {
  return db
    .select({
      id: instruments.id,
      code: instruments.code,
      label: instruments.label,
      unit: instruments.unit,
      min: instruments.min,
      max: instruments.max,
      higherIsBetter: instruments.higherIsBetter,
      mcid: instruments.mcid,
      mcidSource: instruments.mcidSource,
      retired: instruments.retired,
    })
    .from(instruments)
    .orderBy(asc(instruments.id));
}

/** Accepted intervention codes, core first. */
export async function listInterventions(db: Tx): Promise<InterventionInfo[]> {
  return db
    .select({
      id: interventionCodes.id,
      code: interventionCodes.code,
      label: interventionCodes.label,
      kind: interventionCodes.kind,
      graded: interventionCodes.graded,
    })
    .from(interventionCodes)
    .where(eq(interventionCodes.status, 'accepted'))
    .orderBy(sql`${interventionCodes.kind} = 'core' desc`, asc(interventionCodes.id));
}

/** The reference data a write is checked against, read once per request. */
export type ReferenceData = {
  instruments: Map<string, InstrumentInfo>;
  interventions: Map<string, InterventionInfo>;
  conditions: Set<string>;
};

export async function loadReferenceData(db: Tx): Promise<ReferenceData> {
  const [ins, ints, conds] = await Promise.all([
    listInstruments(db),
    listInterventions(db),
    db.select({ code: conditions.code }).from(conditions),
  ]);
  return {
    instruments: new Map(ins.map((i) => [i.code, i])),
    interventions: new Map(ints.map((i) => [i.code, i])),
    conditions: new Set(conds.map((c) => c.code)),
  };
}

/** The caller's clinic salt for pseudonym keys (lead and clinician only). */
export async function clinicPseudonymSalt(db: Tx, scope: Scope): Promise<PseudonymSalt> {
  if (scope.kind !== 'clinic') throw new ForbiddenError('Only a clinic’s lead and clinicians make pseudonyms');
  const [row] = await db
    .select({ id: clinics.id, salt: clinics.pseudonymSalt })
    .from(clinics)
    .where(eq(clinics.id, scope.clinicId));
  if (!row) throw new NotFoundError('Your clinic is not in the registry');
  return { clinicId: row.id, salt: row.salt, iterations: PBKDF2_ITERATIONS, algorithm: PSEUDONYM_ALGORITHM };
}
