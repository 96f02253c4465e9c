import { z } from 'zod';
import { ACTIVITY_PROFILES, BMI_BANDS, DURATION_BANDS, SEXES } from '../constants';
import { IsoDateSchema } from './episode';

/** Five-year age bands as the outcomes engine names them (the registry takes adults, so the first is 15–19). */
export const AGE_BANDS = [
  '15-19',
  '20-24',
  '25-29',
  '30-34',
  '35-39',
  '40-44',
  '45-49',
  '50-54',
  '55-59',
  '60-64',
  '65-69',
  '70-74',
  '75-79',
  '80-84',
  '85-89',
  '90+',
] as const;

/** Baseline severity is read on first-step pain (0–10). */
export const SEVERITY_INSTRUMENT = 'nprs-first-step';

const CodeSchema = z.string().trim().min(1).max(60);

/**
 * A cohort definition. Empty lists and nulls mean "no restriction". Research consent is not a choice: the
 * field may be left out or be `true`, and anything else is refused, so a non-consenting episode never enters.
 */
export const CohortCriteriaSchema = z
  .object({
    conditionCode: CodeSchema.nullable().default(null),
    startFrom: IsoDateSchema.nullable().default(null),
    startTo: IsoDateSchema.nullable().default(null),
    activityProfiles: z.array(z.enum(ACTIVITY_PROFILES)).default([]),
    bmiBands: z.array(z.enum(BMI_BANDS)).default([]),
    ageBands: z.array(z.enum(AGE_BANDS)).default([]),
    sexes: z.array(z.enum(SEXES)).default([]),
    durationBands: z.array(z.enum(DURATION_BANDS)).default([]),
    /** First-step pain at baseline (0–10), both ends included. */
    baselinePain: z
      .object({ min: z.number().min(0).max(10), max: z.number().min(0).max(10) })
      .refine((r) => r.max >= r.min, 'The highest baseline pain must be at least the lowest')
      .nullable()
      .default(null),
    /** Keep only episodes with both a baseline and a primary follow-up score on this instrument. */
    completeInstrument: CodeSchema.nullable().default(null),
    /** Add-ons received: any of the codes, or all of them. */
    addOns: z
      .object({
        codes: z.array(CodeSchema).min(1, 'Choose at least one add-on').max(20),
        match: z.enum(['any', 'all']).default('any'),
      })
      .nullable()
      .default(null),
    researchConsent: z
      .literal(true, { error: 'Research consent is always required: only consenting episodes enter a cohort' })
      .default(true),
  })
  .strict()
  .refine((c) => !c.startFrom || !c.startTo || c.startFrom <= c.startTo, {
    message: 'The period must end on or after its first day',
    path: ['startTo'],
  });
export type CohortCriteria = z.infer<typeof CohortCriteriaSchema>;
export type CohortCriteriaInput = z.input<typeof CohortCriteriaSchema>;

/**
 * A count as shown to the caller: exact; "<k" when it is a small cell and the caller is a researcher; or
 * "hidden" when it is not small but is withheld so that a small cell cannot be worked out from it.
 */
export const CountCellSchema = z.union([z.number().int().min(0), z.string().regex(/^<\d+$/), z.literal('hidden')]);
export type CountCell = z.infer<typeof CountCellSchema>;

export const CohortSaveSchema = z.object({
  name: z.string().trim().min(1, 'Give the cohort a name').max(120),
  description: z.string().trim().max(2000).default(''),
  criteria: CohortCriteriaSchema,
});
export type CohortSave = z.infer<typeof CohortSaveSchema>;

export const CohortDuplicateSchema = z.object({ name: z.string().trim().min(1).max(120).optional() }).strict();
export const CohortPreviewInputSchema = z.object({ criteria: CohortCriteriaSchema });

const Interval = z.object({ estimate: z.number(), lower: z.number().nullable(), upper: z.number().nullable() });

export const AttritionStepSchema = z.object({
  step: z.string(),
  label: z.string(),
  excluded: CountCellSchema,
  remaining: CountCellSchema,
});

export const InstrumentSummarySchema = z.object({
  code: z.string(),
  label: z.string(),
  unit: z.string(),
  higherIsBetter: z.boolean(),
  mcid: z.number().nullable(),
  /** Episodes with a baseline and a primary follow-up. */
  nPaired: CountCellSchema,
  /** null when fewer than the registry's minimum for an estimate. */
  change: z
    .object({
      mean: z.number(),
      lower: z.number().nullable(),
      upper: z.number().nullable(),
      median: z.number(),
      q1: z.number(),
      q3: z.number(),
    })
    .nullable(),
  responders: z.object({ count: CountCellSchema, share: Interval }).nullable(),
});

export const RecoverySummarySchema = z.object({
  instrumentCode: z.string(),
  threshold: z.number(),
  n: CountCellSchema,
  recovered: CountCellSchema,
  atWeeks: z.array(
    z.object({
      weeks: z.number(),
      estimate: z.number().nullable(),
      lower: z.number().nullable(),
      upper: z.number().nullable(),
    }),
  ),
  medianWeeks: z.object({
    estimate: z.number().nullable(),
    lower: z.number().nullable(),
    upper: z.number().nullable(),
  }),
});

export const OutcomeSummarySchema = z.object({
  minEstimate: z.number().int(),
  instruments: z.array(InstrumentSummarySchema),
  /** null when the cohort is below the minimum for an estimate. */
  recovery: RecoverySummarySchema.nullable(),
});
export type OutcomeSummary = z.infer<typeof OutcomeSummarySchema>;

export const CohortPreviewSchema = z.object({
  count: CountCellSchema,
  clinics: z.number().int(),
  attrition: z.array(AttritionStepSchema),
  summary: OutcomeSummarySchema,
  /** The small-cell threshold applied to counts ("<k"), or null when counts are exact (steward). */
  suppressedBelow: z.number().int().nullable(),
  rulesVersion: z.number().int(),
});
export type CohortPreview = z.infer<typeof CohortPreviewSchema>;

export const CohortVersionSchema = z.object({
  version: z.number().int(),
  criteria: CohortCriteriaSchema,
  countAtSave: CountCellSchema,
  savedAt: z.string(),
  rulesVersion: z.number().int(),
});

export const CohortSummarySchema = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string(),
  currentVersion: z.number().int(),
  mine: z.boolean(),
  ownerName: z.string(),
  duplicatedFromId: z.number().int().nullable(),
  countAtSave: CountCellSchema,
  countNow: CountCellSchema,
  /** countNow − countAtSave, or null when either is a suppressed small cell. */
  change: z.number().int().nullable(),
  savedAt: z.string(),
});
export type CohortSummary = z.infer<typeof CohortSummarySchema>;

export const CohortDetailSchema = CohortSummarySchema.extend({
  criteria: CohortCriteriaSchema,
  versions: z.array(CohortVersionSchema),
});
export type CohortDetail = z.infer<typeof CohortDetailSchema>;

export const CohortListSchema = z.object({ items: z.array(CohortSummarySchema), total: z.number().int() });
