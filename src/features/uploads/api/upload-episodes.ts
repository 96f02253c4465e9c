import { useMutation, useQueryClient } from '@tanstack/react-query';
import { UploadResultSchema, type UploadResult } from '../../../../shared/schemas/upload';
import { ApiError, apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/**
 * Sends the CSV: `dryRun` checks it and writes nothing; otherwise it is saved (all rows or none).
 * A 422 is an answer too: it carries the same report with every problem, so it is returned, not thrown.
 */
export async function uploadEpisodes(file: File, dryRun: boolean): Promise<UploadResult> {
  const form = new FormData();
  form.append('file', file, file.name);
  try {
    return await apiFetch(`/api/uploads/episodes?dryRun=${dryRun ? 1 : 0}`, UploadResultSchema, {
      method: 'POST',
      body: form,
    });
  } catch (e) {
    if (e instanceof ApiError && e.status === 422) {
      const report = UploadResultSchema.safeParse(e.body);
      if (report.success) return report.data;
    }
    throw e;
  }
}

export function useUploadEpisodes() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ file, dryRun }: { file: File; dryRun: boolean }) => uploadEpisodes(file, dryRun),
    onSuccess: async (result) => {
      if (result.dryRun) return;
      await Promise.all([
        client.invalidateQueries({ queryKey: queryKeys.uploads.all() }),
        client.invalidateQueries({ queryKey: queryKeys.episodes.lists() }),
      ]);
    },
  });
}
