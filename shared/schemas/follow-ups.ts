import { z } from 'zod';
import { FOLLOW_UP_TIMEPOINTS } from '../constants';
import { FOLLOW_UP_STATES } from '../follow-up-schedule';
import { IsoDateSchema, listOf } from './episode';

// The contract of the follow-up API: due lists, completeness, lost proposals, self-report links, digest preference.

export const FollowUpTimepointSchema = z.enum(FOLLOW_UP_TIMEPOINTS);
export const FollowUpStateSchema = z.enum(FOLLOW_UP_STATES);

/** `?state=due,closing` (comma-separated); the due list shows due and closing follow-ups unless asked otherwise. */
export const FollowUpListQuerySchema = z.object({
  state: z
    .string()
    .default('due,closing')
    .transform((s) =>
      s
        .split(',')
        .map((v) => v.trim())
        .filter(Boolean),
    )
    .pipe(z.array(FollowUpStateSchema).min(1, 'Name at least one state')),
  sort: z.enum(['closesOn', 'opensOn', 'reference', 'timepoint', 'startDate']).default('closesOn'),
  order: z.enum(['asc', 'desc']).default('asc'),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).default(0),
});
export type FollowUpListQuery = z.input<typeof FollowUpListQuerySchema>;

export const FollowUpItemSchema = z.object({
  episodeId: z.number().int(),
  reference: z.string(),
  startDate: IsoDateSchema,
  timepoint: FollowUpTimepointSchema,
  state: FollowUpStateSchema,
  opensOn: IsoDateSchema,
  closesOn: IsoDateSchema,
  daysLeft: z.number().int(),
  /** When a self-report link for this timepoint is waiting to be used: its expiry. */
  linkExpiresAt: z.string().nullable(),
});
export type FollowUpItem = z.infer<typeof FollowUpItemSchema>;
export const FollowUpListSchema = listOf(FollowUpItemSchema).extend({ today: IsoDateSchema });
export type FollowUpList = z.infer<typeof FollowUpListSchema>;

const ShareSchema = z.object({
  /** Episodes whose window closed in the period and were still expected to report. */
  expected: z.number().int(),
  completed: z.number().int(),
  share: z.number().min(0).max(1).nullable(),
});
export const CompletenessSchema = z.object({
  from: IsoDateSchema,
  to: IsoDateSchema,
  target: z.number().min(0).max(1),
  /** Below this many expected follow-ups a share is shown with a "few episodes" note. */
  minCell: z.number().int(),
  timepoints: z.array(z.object({ timepoint: FollowUpTimepointSchema, clinic: ShareSchema, registry: ShareSchema })),
});
export type Completeness = z.infer<typeof CompletenessSchema>;

export const LostProposalSchema = z.object({
  episodeId: z.number().int(),
  reference: z.string(),
  startDate: IsoDateSchema,
  lastAssessedOn: IsoDateSchema.nullable(),
  daysWithoutAssessment: z.number().int(),
  version: z.number().int(),
});
export type LostProposal = z.infer<typeof LostProposalSchema>;
export const LostProposalListSchema = listOf(LostProposalSchema);

export const SelfReportLinkCreateSchema = z.object({ timepoint: FollowUpTimepointSchema }).strict();
export const SelfReportLinkSchema = z.object({ url: z.string().url(), expiresAt: z.string() });
export type SelfReportLink = z.infer<typeof SelfReportLinkSchema>;

/** The client page a patient opens (the token is the whole capability: no sign-in). */
export const selfReportPath = (token: string) => `/report/${token}`;

/** A 32-byte token in base64url: exactly 43 characters; anything else is not one of ours. */
export const SelfReportTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/);

/** How the page asks for a total: a row of rating buttons (whole numbers) or a number field. */
export const SelfReportQuestionSchema = z.object({
  code: z.string(),
  label: z.string(),
  min: z.number(),
  max: z.number(),
  step: z.number().positive(),
  input: z.enum(['rating', 'number']),
});
export type SelfReportQuestion = z.infer<typeof SelfReportQuestionSchema>;

/** Everything the public page is told: no reference, no pseudonym, no dates of care. */
export const SelfReportFormSchema = z.object({
  clinicName: z.string(),
  timepoint: FollowUpTimepointSchema,
  questions: z.array(SelfReportQuestionSchema),
});
export type SelfReportForm = z.infer<typeof SelfReportFormSchema>;

export const SelfReportSubmitSchema = z
  .object({
    scores: z.record(z.string().min(1), z.number().finite()),
    avgDailySteps: z.number().int().min(0).max(100_000).nullable().optional(),
  })
  .strict()
  .refine((s) => Object.keys(s.scores).length > 0, {
    message: 'Answer at least one of the rating questions',
    path: ['scores'],
  });
export type SelfReportSubmit = z.infer<typeof SelfReportSubmitSchema>;
export const SelfReportReceiptSchema = z.object({ received: z.literal(true) });

export const PreferencesSchema = z.object({ digestOptOut: z.boolean() });
export const PreferencesPatchSchema = PreferencesSchema.strict();
export type Preferences = z.infer<typeof PreferencesSchema>;
