import { z } from 'zod';
import { INTERVENTION_KINDS } from '../constants';
import { ROLES } from '../roles';
import { listOf } from './episode';
import { InstrumentInfoSchema, InterventionInfoSchema } from './reference';

export * from './admin-rules';
export * from './admin-audit';

/** Schemas of the steward's console (`/api/admin/...`), the audit trail and the current-rules answer. */

const text = (min: number, max: number, what: string) =>
  z.string().trim().min(min, `Enter the ${what}`).max(max, `Keep the ${what} to ${max} characters`);
const timestamp = z.string();

// ---------- clinics ----------

export const ClinicCodeSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9][A-Z0-9-]{1,11}$/, 'Use 2–12 letters, digits or hyphens for the clinic code');

export const ClinicCreateSchema = z
  .object({ code: ClinicCodeSchema, displayName: text(2, 120, 'clinic name'), region: text(2, 80, 'region') })
  .strict();
export type ClinicCreate = z.infer<typeof ClinicCreateSchema>;

export const ClinicPatchSchema = z
  .object({ displayName: text(2, 120, 'clinic name').optional(), region: text(2, 80, 'region').optional() })
  .strict()
  .refine((p) => p.displayName !== undefined || p.region !== undefined, 'Change the name or the region');
export type ClinicPatch = z.infer<typeof ClinicPatchSchema>;

export const ClinicSummarySchema = z.object({
  id: z.number().int(),
  code: z.string(),
  displayName: z.string(),
  region: z.string(),
  active: z.boolean(),
  createdAt: timestamp,
  activeUsers: z.number().int(),
  episodes: z.number().int(),
  openEpisodes: z.number().int(),
  /** Episodes whose week-12 window has closed, and of those the ones with a week-12 assessment. */
  pastWeek12Window: z.number().int(),
  withWeek12: z.number().int(),
  /** withWeek12 / pastWeek12Window; null when no episode is past its window yet. */
  completeness: z.number().nullable(),
  lastSubmissionAt: timestamp.nullable(),
});
export type ClinicSummary = z.infer<typeof ClinicSummarySchema>;
export const ClinicListSchema = listOf(ClinicSummarySchema);

// ---------- people ----------

export const PERSON_STATUSES = ['invited', 'active', 'deactivated'] as const;

export const PersonSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  clinicId: z.number().int().nullable(),
  clinicCode: z.string().nullable(),
  status: z.enum(PERSON_STATUSES),
  createdAt: timestamp,
  deactivatedAt: timestamp.nullable(),
});
export type Person = z.infer<typeof PersonSchema>;
export const PeopleListSchema = listOf(PersonSchema);

export const PeopleQuerySchema = z.object({
  clinicId: z.coerce.number().int().positive().optional(),
  role: z.enum(ROLES).optional(),
  status: z.enum(PERSON_STATUSES).optional(),
  q: z.string().trim().max(80).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});
export type PeopleQuery = z.infer<typeof PeopleQuerySchema>;

/** A change of role and/or clinic (steward only). Clinic roles need a clinic; steward and researcher have none. */
export const PersonPatchSchema = z
  .object({ role: z.enum(ROLES).optional(), clinicId: z.number().int().positive().nullable().optional() })
  .strict()
  .refine((p) => p.role !== undefined || p.clinicId !== undefined, 'Change the role or the clinic');
export type PersonPatch = z.infer<typeof PersonPatchSchema>;

// ---------- instruments ----------

const InstrumentCodeSchema = z
  .string()
  .trim()
  .toLowerCase()
  .regex(/^[a-z][a-z0-9-]{1,39}$/, 'Use 2–40 lower-case letters, digits or hyphens, starting with a letter');

const instrumentFields = {
  label: text(2, 120, 'label'),
  unit: text(1, 40, 'unit'),
  min: z.number().finite(),
  max: z.number().finite(),
  higherIsBetter: z.boolean(),
  bodyRegion: text(2, 60, 'body region'),
};

/** The steward's view of an instrument: what the forms see, plus where it applies and what is stored on it. */
export const InstrumentSchema = InstrumentInfoSchema.extend({
  bodyRegion: z.string(),
  createdAt: timestamp,
  /** Stored scores and their extremes: the range may never shrink past them. */
  scoreCount: z.number().int(),
  storedMin: z.number().nullable(),
  storedMax: z.number().nullable(),
});
export type Instrument = z.infer<typeof InstrumentSchema>;
export const InstrumentListSchema = listOf(InstrumentSchema);

const McidSchema = z.number().positive('The MCID is a positive number of points').nullable();
const SourceSchema = text(5, 300, 'published source of the MCID');

export const InstrumentCreateSchema = z
  .object({ code: InstrumentCodeSchema, ...instrumentFields, mcid: McidSchema, mcidSource: SourceSchema })
  .strict()
  .refine((i) => i.max > i.min, { path: ['max'], message: 'The top of the range must be above its bottom' })
  .refine((i) => i.mcid === null || i.mcid <= i.max - i.min, { path: ['mcid'], message: 'The MCID cannot exceed the range' });
export type InstrumentCreate = z.infer<typeof InstrumentCreateSchema>;

export const InstrumentPatchSchema = z
  .object(instrumentFields)
  .partial()
  .strict()
  .refine((p) => Object.keys(p).length > 0, 'Change at least one field')
  .refine((p) => p.min === undefined || p.max === undefined || p.max > p.min, {
    path: ['max'],
    message: 'The top of the range must be above its bottom',
  });
export type InstrumentPatch = z.infer<typeof InstrumentPatchSchema>;

/** A new MCID always comes with where it was published. */
export const McidUpdateSchema = z.object({ mcid: McidSchema, source: SourceSchema }).strict();
export type McidUpdate = z.infer<typeof McidUpdateSchema>;

// ---------- intervention codes ----------

const InterventionCodeCodeSchema = z
  .string()
  .trim()
  .toLowerCase()
  .regex(/^[a-z][a-z0-9-]{1,39}$/, 'Use 2–40 lower-case letters, digits or hyphens, starting with a letter');

export const CODE_STATUSES = ['accepted', 'proposed', 'declined'] as const;

/** The steward's view of an intervention code: what the forms see, plus its state and use. */
export const InterventionCodeSchema = InterventionInfoSchema.extend({
  status: z.enum(CODE_STATUSES),
  proposedByClinicId: z.number().int().nullable(),
  proposedByClinicCode: z.string().nullable(),
  createdAt: timestamp,
  /** Episodes that recorded the code. */
  useCount: z.number().int(),
});
export type InterventionCode = z.infer<typeof InterventionCodeSchema>;
export const InterventionCodeListSchema = listOf(InterventionCodeSchema);

export const CodeCreateSchema = z
  .object({
    code: InterventionCodeCodeSchema,
    label: text(2, 120, 'label'),
    kind: z.enum(INTERVENTION_KINDS),
    graded: z.boolean().default(false),
  })
  .strict();
export type CodeCreate = z.infer<typeof CodeCreateSchema>;

export const CodePatchSchema = z
  .object({ label: text(2, 120, 'label').optional(), graded: z.boolean().optional() })
  .strict()
  .refine((p) => p.label !== undefined || p.graded !== undefined, 'Change the label or the grading');
export type CodePatch = z.infer<typeof CodePatchSchema>;

/** A clinic's own code, proposed by its lead; add-ons unless said otherwise. */
export const CodeProposalSchema = CodeCreateSchema.extend({ kind: z.enum(INTERVENTION_KINDS).default('addon') });
export type CodeProposal = z.infer<typeof CodeProposalSchema>;

export const CodeDecisionSchema = z
  .object({ decision: z.enum(['accept', 'decline']), note: z.string().trim().max(300).optional() })
  .strict();
export type CodeDecision = z.infer<typeof CodeDecisionSchema>;

/** A numeric `:id` route parameter (anything else is a 422, never a 500). */
export const IdParamSchema = z.object({ id: z.coerce.number().int().positive() });
