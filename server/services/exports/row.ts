import { randomBytes, randomUUID } from 'node:crypto';
import type { EpisodeField, InstrumentPart, StartGranularity } from '../../../shared/export-columns';
import type { EpisodeFacts, InstrumentFacts } from '../cohorts/derive';
import { tidy } from './csv-cell';
import { startPeriod, type Qi } from './generalise';

/** The ungeneralised quasi-identifiers of one episode (bands from the outcomes engine, the period from the date). */
export function qiOf(f: EpisodeFacts, granularity: StartGranularity): Qi {
  return {
    ageBand: f.ageBand,
    sex: f.sex,
    bmiBand: f.bmiBand,
    activity: f.activityProfile,
    period: startPeriod(f.startDate, granularity),
    region: f.region,
  };
}

/** Per-export random site codes: the same clinic gets a different code in every export. */
export function clinicCoder(): (clinicId: number) => string {
  const codes = new Map<number, string>();
  const used = new Set<string>();
  return (clinicId) => {
    const known = codes.get(clinicId);
    if (known !== undefined) return known;
    let code: string;
    do code = `S${randomBytes(3).toString('hex')}`;
    while (used.has(code));
    codes.set(clinicId, code);
    used.add(code);
    return code;
  };
}

export type Value = string | number | boolean | null;
export type Getter = (f: EpisodeFacts, q: Qi) => Value;

/** Fields read from the exported quasi-identifiers alone (the same for every row of a combination). */
export const QI_FIELDS: ReadonlySet<EpisodeField> = new Set<EpisodeField>([
  'clinic_region',
  'start_period',
  'age_band',
  'sex',
  'bmi_band',
  'activity_profile',
]);

export function fieldGetter(field: EpisodeField, clinicCode: (id: number) => string): Getter {
  const getters: Record<EpisodeField, Getter> = {
    // A fresh random id per row and export: never derived from the pseudonym, so exports cannot be linked.
    study_id: () => randomUUID(),
    clinic_code: (f) => clinicCode(f.clinicId),
    clinic_region: (_f, q) => q.region,
    start_period: (_f, q) => q.period,
    age_band: (_f, q) => q.ageBand,
    sex: (_f, q) => q.sex,
    bmi_band: (_f, q) => q.bmiBand,
    activity_profile: (_f, q) => q.activity,
    // Raw BMI would undo a generalised band, so it goes with it.
    bmi: (f, q) => (q.bmiBand === '*' ? null : tidy(f.bmi, 1)),
    condition_code: (f) => f.conditionCode,
    side: (f) => f.side,
    standing_work: (f) => f.standingWork,
    symptom_duration_band: (f) => f.durationBand,
    recovery_event: (f) => (f.recovery ? f.recovery.event : null),
    recovery_weeks: (f) => (f.recovery ? tidy(f.recovery.time, 2) : null),
    episode_status: (f) => f.status,
    discharge_reason: (f) => f.dischargeReason,
    discharge_day: (f) => f.dischargeDay,
    assessment_count: (f) => f.assessmentCount,
  };
  return getters[field];
}

export const PART: Record<InstrumentPart, (i: InstrumentFacts) => Value> = {
  baseline: (i) => i.baseline,
  followup: (i) => i.followUp,
  followup_day: (i) => i.followUpDay,
  change: (i) => (i.change === null ? null : tidy(i.change)),
  responder: (i) => i.responder,
};
