import { z } from 'zod';
import {
  DATA_REQUEST_STATUSES,
  EXPORT_STATUSES,
  REQUESTABLE_GROUPS,
  START_GRANULARITIES,
  VARIABLE_GROUPS,
} from '../export-columns';
import { IsoDateSchema } from './episode';

/** A researcher turns a saved cohort (its current version) into a request with a purpose and variable groups. */
export const DataRequestCreateSchema = z
  .object({
    cohortId: z.number().int().positive(),
    purpose: z.string().trim().min(20, 'Describe the purpose in a sentence or two (20 characters or more)').max(2000),
    variableGroups: z
      .array(z.enum(REQUESTABLE_GROUPS))
      .max(REQUESTABLE_GROUPS.length)
      .default([])
      .transform((g) => [...new Set(g)]),
  })
  .strict();
export type DataRequestCreate = z.infer<typeof DataRequestCreateSchema>;

/** The steward's approval and its conditions. `k` never below 3; the registry's export k when left out. */
export const DataRequestApproveSchema = z
  .object({
    expiresOn: IsoDateSchema,
    startGranularity: z.enum(START_GRANULARITIES).default('year'),
    allowRawBmi: z.boolean().default(false),
    k: z.number().int().min(3, 'k is never below 3').max(100).optional(),
  })
  .strict();
export type DataRequestApprove = z.infer<typeof DataRequestApproveSchema>;

export const DataRequestDeclineSchema = z
  .object({ reason: z.string().trim().min(5, 'Give the researcher a reason').max(1000) })
  .strict();

export const DictionaryQuerySchema = z.object({ format: z.enum(['csv', 'md']).default('md') });

export const ExportSummarySchema = z.object({
  id: z.number().int(),
  status: z.enum(EXPORT_STATUSES),
  rowCount: z.number().int(),
  generalisedRows: z.number().int(),
  suppressedRows: z.number().int(),
  finishedAt: z.string(),
});

export const DataRequestSchema = z.object({
  id: z.number().int(),
  cohortId: z.number().int(),
  cohortName: z.string(),
  cohortVersion: z.number().int(),
  requester: z.object({ id: z.number().int(), name: z.string(), email: z.string() }),
  mine: z.boolean(),
  purpose: z.string(),
  variableGroups: z.array(z.enum(VARIABLE_GROUPS)),
  status: z.enum(DATA_REQUEST_STATUSES),
  decidedAt: z.string().nullable(),
  declineReason: z.string().nullable(),
  expiresOn: z.string().nullable(),
  startGranularity: z.enum(START_GRANULARITIES).nullable(),
  allowRawBmi: z.boolean(),
  k: z.number().int().nullable(),
  /** Approved, not expired, and the caller is the requester. */
  downloadable: z.boolean(),
  createdAt: z.string(),
  exports: z.array(ExportSummarySchema),
});
export type DataRequest = z.infer<typeof DataRequestSchema>;
export const DataRequestListSchema = z.object({ items: z.array(DataRequestSchema), total: z.number().int() });

export const ExportLogEntrySchema = ExportSummarySchema.extend({
  requestId: z.number().int(),
  cohortName: z.string(),
  user: z.object({ id: z.number().int(), name: z.string(), email: z.string() }),
  k: z.number().int(),
  byteCount: z.number().int(),
  sha256: z.string(),
  startedAt: z.string(),
});
export type ExportLogEntry = z.infer<typeof ExportLogEntrySchema>;
export const ExportLogSchema = z.object({ items: z.array(ExportLogEntrySchema), total: z.number().int() });
