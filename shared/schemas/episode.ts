import { z } from 'zod';
import {
  ACTIVITY_PROFILES, BMI_BANDS, DISCHARGE_REASONS, EPISODE_STATUSES, INTERVENTION_KINDS, REPORTERS, SEXES, SIDES, TIMEPOINTS,
} from '../constants';

/** A calendar date as 'YYYY-MM-DD' that exists (no 2026-02-30). Dates are dates: no time zone. */
export const IsoDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-31')
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, 'This date does not exist');

/** HMAC-SHA-256 pseudonym made at the clinic: exactly 64 lower-case hex characters. */
export const PseudonymSchema = z
  .string()
  .transform((s) => s.trim().toLowerCase())
  .pipe(z.string().regex(/^[0-9a-f]{64}$/, 'A pseudonym is 64 hexadecimal characters (a keyed hash), never a name or number'));

const EMAIL_LIKE = /[^\s@]+@[^\s@]+\.[^\s@]+/;
const PHONE_LIKE = /(\+?\d[\d\s().-]{7,}\d)/;
const DATE_LIKE = /\b(\d{1,2}[./-]\d{1,2}[./-]\d{2,4}|\d{4}-\d{2}-\d{2})\b/;

/** The clinic's own episode reference: short, and never something that could carry an identifier. */
export const EpisodeReferenceSchema = z
  .string()
  .trim()
  .min(1, 'Enter the clinic’s episode reference')
  .max(40, 'Keep the reference to 40 characters')
  .refine((s) => !EMAIL_LIKE.test(s), 'The reference looks like an e-mail address; use the clinic’s own code instead')
  .refine((s) => !PHONE_LIKE.test(s), 'The reference looks like a phone number; use the clinic’s own code instead')
  .refine((s) => !DATE_LIKE.test(s), 'The reference looks like a date (of birth?); use the clinic’s own code instead')
  .refine((s) => /^[A-Za-z0-9][A-Za-z0-9_./-]*$/.test(s), 'Use letters, digits and - _ . / only');

/** Scores of one assessment: instrument code → total. Ranges are checked against the instrument rows. */
export const ScoresSchema = z.record(z.string().min(1), z.number().finite()).refine((s) => Object.keys(s).length > 0, {
  message: 'Enter at least one score',
});

export const AssessmentInputSchema = z.object({
  assessedOn: IsoDateSchema,
  timepoint: z.enum(TIMEPOINTS),
  reporter: z.enum(REPORTERS).default('clinician'),
  scores: ScoresSchema,
  avgDailySteps: z.number().int().min(0).max(100_000).nullable().optional(),
  adverseEvent: z.string().trim().max(40).regex(/^[a-z0-9-]*$/, 'Use a coded adverse event').nullable().optional(),
});
export type AssessmentInput = z.infer<typeof AssessmentInputSchema>;

export const InterventionInputSchema = z.object({
  code: z.string().min(1),
  startWeek: z.number().int().min(0).max(104).default(0),
  maxLevel: z.number().int().min(1).max(3).nullable().optional(),
});
export type InterventionInput = z.infer<typeof InterventionInputSchema>;

const episodeFields = {
  pseudonym: PseudonymSchema,
  reference: EpisodeReferenceSchema,
  conditionCode: z.string().min(1).default('plantar-heel-pain'),
  side: z.enum(SIDES),
  startDate: IsoDateSchema,
  symptomWeeks: z.number().int().min(0).max(1040),
  ageYears: z.number().int().min(16, 'The registry takes adults (16 and over)').max(110),
  sex: z.enum(SEXES),
  heightCm: z.number().min(100).max(230),
  weightKg: z.number().min(30).max(300),
  activityProfile: z.enum(ACTIVITY_PROFILES),
  standingWork: z.boolean(),
  researchConsent: z.boolean(),
};

/** A new episode with its baseline assessment. The baseline's date must be the start date or later. */
export const EpisodeCreateSchema = z.object({
  ...episodeFields,
  baseline: AssessmentInputSchema.omit({ timepoint: true }),
  interventions: z.array(InterventionInputSchema).default([]),
});
export type EpisodeCreate = z.infer<typeof EpisodeCreateSchema>;

/** A change to an episode; `version` must match the stored one (optimistic locking, stale → 409). */
export const EpisodePatchSchema = z
  .object(episodeFields)
  .partial()
  .extend({
    status: z.enum(EPISODE_STATUSES).optional(),
    dischargeDate: IsoDateSchema.nullable().optional(),
    dischargeReason: z.enum(DISCHARGE_REASONS).nullable().optional(),
    version: z.number().int().min(1),
  })
  .strict();
export type EpisodePatch = z.infer<typeof EpisodePatchSchema>;

export const EpisodeListQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(25),
  offset: z.coerce.number().int().min(0).default(0),
  sort: z.enum(['startDate', 'reference', 'status', 'weeksInCare']).default('startDate'),
  order: z.enum(['asc', 'desc']).default('desc'),
  status: z.enum(EPISODE_STATUSES).optional(),
  q: z.string().trim().max(40).optional(),
  /** Steward only: one clinic's episodes (lead and clinician always see their own clinic). */
  clinicId: z.coerce.number().int().min(1).optional(),
});
export type EpisodeListQuery = z.infer<typeof EpisodeListQuerySchema>;

/** Any list endpoint answers `{ items, total }`. */
export const listOf = <T extends z.ZodType>(item: T) => z.object({ items: z.array(item), total: z.number().int() });

// ---------- answers of the episode API ----------

/** A stored assessment with its scores (instrument code → total) and its day since the episode's start. */
export const AssessmentSchema = z.object({
  id: z.number().int(),
  assessedOn: z.string(),
  timepoint: z.enum(TIMEPOINTS),
  reporter: z.enum(REPORTERS),
  daysSinceStart: z.number().int(),
  avgDailySteps: z.number().int().nullable(),
  adverseEvent: z.string().nullable(),
  scores: z.record(z.string(), z.number()),
});
export type Assessment = z.infer<typeof AssessmentSchema>;

/** An intervention the episode received, with its code's label and kind. */
export const EpisodeInterventionSchema = z.object({
  code: z.string(),
  label: z.string(),
  kind: z.enum(INTERVENTION_KINDS),
  graded: z.boolean(),
  startWeek: z.number().int(),
  maxLevel: z.number().int().nullable(),
});
export type EpisodeIntervention = z.infer<typeof EpisodeInterventionSchema>;

/** `PUT /api/episodes/:id/interventions`: the full list (replaces what was recorded). */
export const InterventionsPutSchema = z.object({ interventions: z.array(InterventionInputSchema).max(40) }).strict();
export type InterventionsPut = z.infer<typeof InterventionsPutSchema>;

/** One row of `GET /api/episodes`. Pain change is latest minus baseline (negative = less pain). */
export const EpisodeListItemSchema = z.object({
  id: z.number().int(),
  clinicId: z.number().int(),
  reference: z.string(),
  startDate: z.string(),
  status: z.enum(EPISODE_STATUSES),
  weeksInCare: z.number().int(),
  activityProfile: z.enum(ACTIVITY_PROFILES),
  lastAssessedOn: z.string().nullable(),
  latestFirstStepPain: z.number().nullable(),
  firstStepPainChange: z.number().nullable(),
  version: z.number().int(),
});
export type EpisodeListItem = z.infer<typeof EpisodeListItemSchema>;
export const EpisodeListSchema = listOf(EpisodeListItemSchema);

/** `GET /api/episodes/:id` (also the answer of create and patch): BMI and its WHO band are derived, never stored. */
export const EpisodeDetailSchema = z.object({
  id: z.number().int(),
  clinicId: z.number().int(),
  pseudonym: z.string(),
  reference: z.string(),
  conditionCode: z.string(),
  side: z.enum(SIDES),
  startDate: z.string(),
  symptomWeeks: z.number().int(),
  ageYears: z.number().int(),
  sex: z.enum(SEXES),
  heightCm: z.number(),
  weightKg: z.number(),
  activityProfile: z.enum(ACTIVITY_PROFILES),
  standingWork: z.boolean(),
  researchConsent: z.boolean(),
  status: z.enum(EPISODE_STATUSES),
  dischargeDate: z.string().nullable(),
  dischargeReason: z.enum(DISCHARGE_REASONS).nullable(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  bmi: z.number(),
  bmiBand: z.enum(BMI_BANDS),
  assessments: z.array(AssessmentSchema),
  interventions: z.array(EpisodeInterventionSchema),
});
export type EpisodeDetail = z.infer<typeof EpisodeDetailSchema>;
