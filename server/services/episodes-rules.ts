import type { FieldProblem } from './reference-checks';

/** The fields that decide whether an episode's status is coherent. */
export type EpisodeState = {
  startDate: string;
  status: 'open' | 'discharged' | 'lost';
  dischargeDate: string | null;
  dischargeReason: string | null;
};

/**
 * Status rules shared by the form (PATCH) and the upload: a discharged episode has a date and a reason,
 * an open one has neither, and nothing ends before it started.
 */
export function episodeStateProblems(e: EpisodeState): FieldProblem[] {
  const out: FieldProblem[] = [];
  if (e.status === 'discharged') {
    if (!e.dischargeDate) out.push({ field: 'dischargeDate', message: 'Enter the discharge date of a discharged episode' });
    if (!e.dischargeReason) out.push({ field: 'dischargeReason', message: 'Enter why the episode was discharged' });
  }
  if (e.status === 'open') {
    if (e.dischargeDate) out.push({ field: 'dischargeDate', message: 'An open episode has no discharge date; set the status to discharged, or clear the date' });
    if (e.dischargeReason) out.push({ field: 'dischargeReason', message: 'An open episode has no discharge reason; set the status, or clear the reason' });
  }
  if (e.dischargeDate && e.dischargeDate < e.startDate) {
    out.push({ field: 'dischargeDate', message: `The discharge date ${e.dischargeDate} is before the episode’s start (${e.startDate})` });
  }
  return out;
}

/** A baseline is on or after the start; a follow-up is never dated before the baseline. */
export function assessmentDateProblem(
  timepoint: string,
  assessedOn: string,
  startDate: string,
  baselineOn: string | null,
): string | null {
  if (timepoint === 'baseline') {
    return assessedOn < startDate ? `The baseline (${assessedOn}) cannot be dated before the episode’s start (${startDate})` : null;
  }
  if (baselineOn === null) return 'Record the baseline assessment before any follow-up';
  return assessedOn < baselineOn ? `A follow-up (${assessedOn}) cannot be dated before the baseline (${baselineOn})` : null;
}
