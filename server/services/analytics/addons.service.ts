import { and, asc, eq } from 'drizzle-orm';
import {
  addOnAssociations,
  classifyResponder,
  stratumKey,
  symptomDurationBand,
  type AddOnEpisode,
} from '../../../analysis/index';
import type { AddOnsResponse } from '../../../shared/schemas/analytics';
import type { Db } from '../../db/client';
import { interventionCodes } from '../../db/schema';
import { ValidationError } from '../../errors';
import { metaOf, publicInstrument, type AnalyticsContext } from './context';
import { loadEpisodeTuples, type TupleOptions } from './episode-tuples';
import { factsFor, followUpWindow, responderInput, restrictToSubgroup } from './tuple-inputs';
import { suppressSmall } from './suppress';

/** The one query of the exercise signals: responder inputs, strata facts and add-on codes per episode. */
export function addOnsTupleOptions(ctx: AnalyticsContext): TupleOptions {
  return {
    cohort: {
      clinicId: ctx.subjectClinic?.id ?? null,
      consentingOnly: ctx.consentingOnly,
      activeClinicsOnly: false,
      filters: ctx.filters,
    },
    ownClinicId: null,
    responder: { instrumentId: ctx.instrument.id, ...ctx.rules.rules.primaryWindow },
    addOns: true,
    facts: factsFor(ctx.filters, 'activity', 'duration'),
  };
}

/**
 * Exercise signals: per add-on, the risk ratio of responding with versus without it, crude and
 * Mantel-Haenszel-adjusted by activity profile × symptom-duration band, with BH-adjusted p-values.
 * Observational associations only, confounded by who receives which add-on.
 */
export async function addOnSignals(db: Db, ctx: AnalyticsContext, dataVersion: number): Promise<AddOnsResponse> {
  const mcid = ctx.instrument.mcid;
  if (mcid === null) {
    throw new ValidationError('This instrument has no MCID, so responders cannot be counted', [
      { path: ['instrument'], message: 'Choose an instrument with an MCID' },
    ]);
  }
  const rules = ctx.rules.rules;
  const [codes, all] = await Promise.all([
    db
      .select({ code: interventionCodes.code, label: interventionCodes.label })
      .from(interventionCodes)
      .where(and(eq(interventionCodes.kind, 'addon'), eq(interventionCodes.status, 'accepted')))
      .orderBy(asc(interventionCodes.code)),
    loadEpisodeTuples(db, addOnsTupleOptions(ctx)),
  ]);
  const tuples = restrictToSubgroup(all, ctx.filters, ctx.instrument);
  const opts = { higherIsBetter: ctx.instrument.higherIsBetter, threshold: mcid, window: followUpWindow(rules) };
  const episodes: AddOnEpisode[] = tuples.map((t) => {
    const { status } = classifyResponder(responderInput(t), opts);
    return {
      responder: status === 'responder' ? true : status === 'non-responder' ? false : null,
      addOns: t.addons ?? [],
      stratum: stratumKey(t.activity_profile, t.symptom_weeks === null ? null : symptomDurationBand(t.symptom_weeks)),
    };
  });
  const minArm = rules.minCellEstimate;
  const report = addOnAssociations(episodes, { addOns: codes.map((c) => c.code), minArm });
  const hide = suppressSmall(ctx);
  const labelOf = new Map(codes.map((c) => [c.code, c.label]));
  return {
    rulesVersion: ctx.rules.version,
    meta: metaOf(ctx, dataVersion),
    instrument: publicInstrument(ctx.instrument),
    nEpisodes: hide(report.nEpisodes),
    nMissingOutcome: hide(report.nMissingOutcome),
    minArm,
    stratifiedBy: 'activity profile × symptom duration band',
    rows: report.comparisons.map((c) => ({
      code: c.addOn,
      label: labelOf.get(c.addOn) ?? c.addOn,
      withAddOn: { n: hide(c.withAddOn.n), responders: hide(c.withAddOn.responders) },
      withoutAddOn: { n: hide(c.withoutAddOn.n), responders: hide(c.withoutAddOn.responders) },
      suppressed: c.suppressed,
      crude: c.riskRatio,
      adjusted: c.mhRiskRatio,
      riskDifference: c.riskDifference,
      mhStrata: c.mhStrata,
      pValue: c.pValue,
      pAdjusted: c.pAdjusted,
    })),
  };
}
