import { z } from 'zod';
import { listOf } from './episode';

/** One problem in an uploaded file. `row` is the line in the file (header = 1; 0 = the whole file). */
export const UploadIssueSchema = z.object({
  row: z.number().int(),
  column: z.string().nullable(),
  message: z.string(),
});
export type UploadIssue = z.infer<typeof UploadIssueSchema>;

/** What a commit wrote, or a dry run would write. Unchanged rows are already stored exactly as in the file. */
export const UploadChangesSchema = z.object({
  episodesCreated: z.number().int(),
  episodesUpdated: z.number().int(),
  assessmentsCreated: z.number().int(),
  assessmentsUpdated: z.number().int(),
  rowsUnchanged: z.number().int(),
});
export type UploadChanges = z.infer<typeof UploadChangesSchema>;

/**
 * The answer of `POST /api/uploads/episodes`: 200 when every row is valid, 422 otherwise (nothing written).
 * `errors` lists at most `UPLOAD_MAX_ISSUES` problems; `rejected` counts every rejected row.
 */
export const UploadResultSchema = z.object({
  dryRun: z.boolean(),
  accepted: z.number().int(),
  rejected: z.number().int(),
  errors: z.array(UploadIssueSchema),
  truncated: z.boolean(),
  changes: UploadChangesSchema.nullable(),
  uploadId: z.number().int().nullable(),
});
export type UploadResult = z.infer<typeof UploadResultSchema>;
export const UPLOAD_MAX_ISSUES = 500;

/** One committed upload of the clinic (`GET /api/uploads`). */
export const UploadRecordSchema = z.object({
  id: z.number().int(),
  clinicId: z.number().int(),
  fileName: z.string(),
  rowCount: z.number().int(),
  accepted: z.number().int(),
  rejected: z.number().int(),
  status: z.enum(['dry-run', 'committed', 'rejected']),
  createdAt: z.string(),
});
export type UploadRecord = z.infer<typeof UploadRecordSchema>;
export const UploadListSchema = listOf(UploadRecordSchema);
export const UploadListQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(25),
  offset: z.coerce.number().int().min(0).default(0),
});
