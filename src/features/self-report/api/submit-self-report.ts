import { useMutation } from '@tanstack/react-query';
import { SelfReportReceiptSchema, type SelfReportSubmit } from '../../../../shared/schemas/follow-ups';
import { apiFetch } from '../../../lib/api-client';

export const submitSelfReport = (token: string, answers: SelfReportSubmit) =>
  apiFetch(`/api/self-report/${encodeURIComponent(token)}`, SelfReportReceiptSchema, { method: 'POST', body: answers });

export const useSubmitSelfReport = (token: string) =>
  useMutation({ mutationFn: (answers: SelfReportSubmit) => submitSelfReport(token, answers) });
