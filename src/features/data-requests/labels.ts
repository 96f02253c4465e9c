import type { DataRequestStatus, ExportStatus } from '../../../shared/export-columns';

export const STATUS_LABELS: Record<DataRequestStatus, string> = {
  pending: 'Waiting for the steward',
  approved: 'Approved',
  declined: 'Declined',
};
export const STATUS_CLASSES: Record<DataRequestStatus, string> = {
  pending: 'border-caution/40 text-caution',
  approved: 'border-good/40 text-good',
  declined: 'border-bad/40 text-bad',
};
export const EXPORT_STATUS_LABELS: Record<ExportStatus, string> = {
  completed: 'Completed',
  aborted: 'Abandoned by the client',
  failed: 'Failed on the server',
};
