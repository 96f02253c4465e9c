import { ageBand, bmi, bmiBand, symptomDurationBand } from '../../../analysis';
import type { DeriveContext, EpisodeFacts, FactsRow, InstrumentFacts } from '../cohorts/derive';

/** Shared by every counting fact: nothing ever adds to it. */
const NO_SCORES: Map<string, InstrumentFacts> = new Map();

/**
 * The facts of one episode for the counting pass when the cohort's criteria need no scores (`needsScores` is
 * false, so no criterion reads them): the episode's fields and bands, made with the outcomes engine's own band
 * functions exactly as `deriveFacts` makes them, and no score facts. `deriveFacts` would also build empty score
 * facts for every instrument, which was half the garbage of the counting pass. The file pass still uses
 * `deriveFacts`; tests/server/exports-counting-facts.test.ts checks the two agree on every field filled here.
 */
export function countingFacts(row: FactsRow, ctx: DeriveContext): EpisodeFacts {
  const codes = new Set<string>();
  for (const id of row.interventions ?? []) {
    const c = ctx.ref.interventionById.get(id);
    if (c) codes.add(c.code);
  }
  const value = bmi(row.height_cm, row.weight_kg);
  return {
    id: row.id,
    clinicId: row.clinic_id,
    region: row.region,
    conditionCode: row.condition_code,
    startDate: row.start_date,
    researchConsent: row.research_consent,
    sex: row.sex,
    activityProfile: row.activity_profile,
    side: row.side,
    standingWork: row.standing_work,
    status: row.status,
    dischargeReason: row.discharge_reason,
    dischargeDay: row.discharge_day,
    ageBand: ageBand(row.age_years),
    bmi: value,
    bmiBand: bmiBand(value),
    durationBand: symptomDurationBand(row.symptom_weeks),
    byInstrument: NO_SCORES,
    recovery: null,
    interventionCodes: codes,
    assessmentCount: 0,
  };
}
