import { z } from 'zod';
import { INTERVENTION_KINDS } from '../constants';
import { listOf } from './episode';

/** `GET /api/instruments`: what the forms and the upload need (range, direction, MCID and its source). */
export const InstrumentInfoSchema = z.object({
  id: z.number().int(),
  code: z.string(),
  label: z.string(),
  unit: z.string(),
  min: z.number(),
  max: z.number(),
  higherIsBetter: z.boolean(),
  mcid: z.number().nullable(),
  mcidSource: z.string(),
  retired: z.boolean(),
});
export type InstrumentInfo = z.infer<typeof InstrumentInfoSchema>;
export const InstrumentInfoListSchema = listOf(InstrumentInfoSchema);

/** `GET /api/interventions`: accepted codes only (proposals are the steward's business). */
export const InterventionInfoSchema = z.object({
  id: z.number().int(),
  code: z.string(),
  label: z.string(),
  kind: z.enum(INTERVENTION_KINDS),
  graded: z.boolean(),
});
export type InterventionInfo = z.infer<typeof InterventionInfoSchema>;
export const InterventionInfoListSchema = listOf(InterventionInfoSchema);

/** `GET /api/clinics/current/pseudonym-salt`: not a secret, but only the clinic's own people need it. */
export const PseudonymSaltSchema = z.object({
  clinicId: z.number().int(),
  salt: z.string().regex(/^[0-9a-f]{32}$/),
  iterations: z.number().int(),
  algorithm: z.string(),
});
export type PseudonymSalt = z.infer<typeof PseudonymSaltSchema>;
