import { ne } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { conditions, instruments, interventionCodes } from '../../db/schema';
import { ValidationError } from '../../errors';
import type { CohortCriteria } from '../../../shared/schemas/cohort';

export type InstrumentRef = {
  id: number;
  code: string;
  label: string;
  unit: string;
  min: number;
  max: number;
  higherIsBetter: boolean;
  mcid: number | null;
  retired: boolean;
};
export type InterventionRef = { id: number; code: string; label: string; kind: 'core' | 'addon'; accepted: boolean };

/** The reference rows a cohort or an export needs, keyed both ways. */
export type Reference = {
  instruments: InstrumentRef[];
  instrumentById: Map<number, InstrumentRef>;
  instrumentByCode: Map<string, InstrumentRef>;
  interventions: InterventionRef[];
  interventionById: Map<number, InterventionRef>;
  conditions: Set<string>;
};

export async function loadReference(db: Db): Promise<Reference> {
  const [inst, ints, conds] = await Promise.all([
    db.select().from(instruments).orderBy(instruments.id),
    // Declined proposals never reach an episode; proposed ones are kept out of exports (a clinic's own wording).
    db.select().from(interventionCodes).where(ne(interventionCodes.status, 'declined')).orderBy(interventionCodes.id),
    db.select({ code: conditions.code }).from(conditions),
  ]);
  const instrumentList: InstrumentRef[] = inst.map((i) => ({
    id: i.id,
    code: i.code,
    label: i.label,
    unit: i.unit,
    min: i.min,
    max: i.max,
    higherIsBetter: i.higherIsBetter,
    mcid: i.mcid,
    retired: i.retired,
  }));
  const interventionList: InterventionRef[] = ints.map((c) => ({
    id: c.id,
    code: c.code,
    label: c.label,
    kind: c.kind,
    accepted: c.status === 'accepted',
  }));
  return {
    instruments: instrumentList,
    instrumentById: new Map(instrumentList.map((i) => [i.id, i])),
    instrumentByCode: new Map(instrumentList.map((i) => [i.code, i])),
    interventions: interventionList,
    interventionById: new Map(interventionList.map((c) => [c.id, c])),
    conditions: new Set(conds.map((c) => c.code)),
  };
}

/** Criteria may only name codes the registry knows: an unknown code is a 422, never an empty cohort. */
export function assertKnownCodes(ref: Reference, c: CohortCriteria): void {
  const issues: { path: (string | number)[]; message: string }[] = [];
  if (c.conditionCode && !ref.conditions.has(c.conditionCode)) {
    issues.push({ path: ['criteria', 'conditionCode'], message: `Unknown condition "${c.conditionCode}"` });
  }
  if (c.completeInstrument && !ref.instrumentByCode.has(c.completeInstrument)) {
    issues.push({ path: ['criteria', 'completeInstrument'], message: `Unknown instrument "${c.completeInstrument}"` });
  }
  const addOns = new Set(ref.interventions.filter((i) => i.kind === 'addon' && i.accepted).map((i) => i.code));
  c.addOns?.codes.forEach((code, i) => {
    if (!addOns.has(code))
      issues.push({ path: ['criteria', 'addOns', 'codes', i], message: `Unknown add-on "${code}"` });
  });
  if (issues.length > 0) throw new ValidationError('Some criteria name codes the registry does not know', issues);
}
