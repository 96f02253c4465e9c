import { FOLLOW_UP_TIMEPOINTS, type Timepoint } from './constants';

/**
 * The follow-up schedule of one episode, as a pure function of calendar dates.
 * Dates are dates: every computation works on 'YYYY-MM-DD' strings turned into whole UTC day numbers,
 * so the answer never depends on the time zone of the process that computes it.
 */

export type FollowUpTimepoint = (typeof FOLLOW_UP_TIMEPOINTS)[number];

/** Our own state codes (labels live in the client). */
export const FOLLOW_UP_STATES = ['upcoming', 'due', 'closing', 'missed', 'done'] as const;
export type FollowUpState = (typeof FOLLOW_UP_STATES)[number];

/** A window that ends within this many days is "closing" (common practice: a week's notice). */
export const CLOSING_WITHIN_DAYS = 7;

/** No assessment for 26 weeks proposes the episode as lost to follow-up (registry setting, common practice). */
export const LOST_AFTER_DAYS = 26 * 7;

/** Days since the episode's start, inclusive at both ends. */
export type DayWindow = { fromDay: number; toDay: number };
export type FollowUpWindows = Record<FollowUpTimepoint, DayWindow>;

export type AssessmentMark = { timepoint: Timepoint; assessedOn: string };

export type ScheduledFollowUp = {
  timepoint: FollowUpTimepoint;
  opensOn: string;
  closesOn: string;
  state: FollowUpState;
  /** Days from today to the window's last day (negative once it has passed). */
  daysLeft: number;
  /** The date of the assessment that completes this timepoint, when there is one. */
  doneOn: string | null;
};

const MS_PER_DAY = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Whole days since 1970-01-01 for a 'YYYY-MM-DD' date (UTC arithmetic; throws on anything else). */
export function dayNumber(iso: string): number {
  const m = ISO_DATE.exec(iso);
  if (!m) throw new RangeError(`Not a calendar date: ${iso}`);
  const ms = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
  if (new Date(ms).toISOString().slice(0, 10) !== iso) throw new RangeError(`No such date: ${iso}`);
  return ms / MS_PER_DAY;
}

export function isoFromDayNumber(day: number): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
}

export function addDays(iso: string, days: number): string {
  return isoFromDayNumber(dayNumber(iso) + days);
}

/** `to` minus `from`, in days. */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to) - dayNumber(from);
}

/** Today's calendar date in UTC (the registry's one clock; clinics' local dates may differ by a day). */
export function todayUtc(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/**
 * The assessment that completes a timepoint: one recorded for that timepoint (whatever its date), else a
 * discharge or interim assessment dated inside the window. An assessment recorded for another scheduled
 * timepoint never counts twice.
 */
export function completingAssessment(
  timepoint: FollowUpTimepoint,
  opensOn: string,
  closesOn: string,
  assessments: readonly AssessmentMark[],
): AssessmentMark | undefined {
  const labelled = assessments.filter((a) => a.timepoint === timepoint);
  if (labelled.length > 0) return [...labelled].sort((a, b) => a.assessedOn.localeCompare(b.assessedOn))[0];
  return assessments
    .filter(
      (a) =>
        (a.timepoint === 'discharge' || a.timepoint === 'interim') &&
        a.assessedOn >= opensOn &&
        a.assessedOn <= closesOn,
    )
    .sort((a, b) => a.assessedOn.localeCompare(b.assessedOn))[0];
}

/** The state of one timepoint on `today`. */
export function followUpState(daysSinceStart: number, window: DayWindow, done: boolean): FollowUpState {
  if (done) return 'done';
  if (daysSinceStart < window.fromDay) return 'upcoming';
  if (daysSinceStart > window.toDay) return 'missed';
  return window.toDay - daysSinceStart <= CLOSING_WITHIN_DAYS ? 'closing' : 'due';
}

/** Every scheduled follow-up of an episode that started on `startDate`, as seen on `today`. */
export function followUpSchedule(
  startDate: string,
  today: string,
  windows: FollowUpWindows,
  assessments: readonly AssessmentMark[] = [],
): ScheduledFollowUp[] {
  const since = daysBetween(startDate, today);
  return FOLLOW_UP_TIMEPOINTS.map((timepoint) => {
    const window = windows[timepoint];
    const opensOn = addDays(startDate, window.fromDay);
    const closesOn = addDays(startDate, window.toDay);
    const done = completingAssessment(timepoint, opensOn, closesOn, assessments);
    return {
      timepoint,
      opensOn,
      closesOn,
      state: followUpState(since, window, done !== undefined),
      daysLeft: window.toDay - since,
      doneOn: done?.assessedOn ?? null,
    };
  });
}

/**
 * Days an open episode has gone without an assessment (counted from its start when it has none), or null
 * while that is under `LOST_AFTER_DAYS`: only then is it proposed as lost, and only a person changes it.
 */
export function daysWithoutAssessment(
  startDate: string,
  lastAssessedOn: string | null,
  today: string,
  after: number = LOST_AFTER_DAYS,
): number | null {
  const since = daysBetween(lastAssessedOn && lastAssessedOn > startDate ? lastAssessedOn : startDate, today);
  return since >= after ? since : null;
}
