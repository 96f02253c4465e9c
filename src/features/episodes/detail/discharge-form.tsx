import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { DISCHARGE_REASONS } from '../../../../shared/constants';
import { IsoDateSchema, type EpisodeDetail } from '../../../../shared/schemas/episode';
import { ErrorNotice, STALE_EDIT } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { queryKeys } from '../../../lib/query-keys';
import { useUpdateEpisode } from '../api/update-episode';
import { formatDate, todayIso } from '../format';
import { applyServerIssues, friendlyIssue } from '../form-validation';
import { DISCHARGE_REASON_LABELS, STATUS_LABELS } from '../labels';

/** The discharge part of EpisodePatchSchema, with every field required (the version is added on save). */
const DischargeSchema = z.object({
  status: z.enum(['discharged', 'lost']),
  dischargeDate: IsoDateSchema,
  dischargeReason: z.enum(DISCHARGE_REASONS),
});
type DischargeInput = z.input<typeof DischargeSchema>;
type Discharge = z.output<typeof DischargeSchema>;

/** Ends the episode (or reopens an ended one); a stale version gets a 409 and a clear "reload" message. */
export function DischargeForm({ episode }: { episode: EpisodeDetail }) {
  const update = useUpdateEpisode(episode.id);
  const client = useQueryClient();
  const { register, handleSubmit, setError, formState } = useForm<DischargeInput, unknown, Discharge>({
    resolver: zodResolver(DischargeSchema, { error: friendlyIssue }),
    defaultValues: { status: 'discharged', dischargeDate: todayIso() },
  });
  const errors = formState.errors;
  const reload = () => {
    update.reset();
    void client.invalidateQueries({ queryKey: queryKeys.episodes.detail(episode.id) });
  };
  const failure = update.error ? (
    <ErrorNotice error={update.error} title="The change was not saved" conflict={STALE_EDIT} onRetry={reload} />
  ) : null;

  if (episode.status !== 'open') {
    return (
      <div className="space-y-3">
        <p className="text-sm text-ink-soft">
          {STATUS_LABELS[episode.status]} on {formatDate(episode.dischargeDate)}
          {episode.dischargeReason ? ` (${DISCHARGE_REASON_LABELS[episode.dischargeReason]})` : ''}.
        </p>
        <button
          type="button"
          disabled={update.isPending}
          onClick={() =>
            update.mutate({ status: 'open', dischargeDate: null, dischargeReason: null, version: episode.version })
          }
          className="rounded border border-line bg-surface px-4 py-2 text-sm hover:border-accent"
        >
          Reopen the episode
        </button>
        {failure}
      </div>
    );
  }

  const onSubmit = handleSubmit(async (values) => {
    try {
      await update.mutateAsync({ ...values, version: episode.version });
    } catch (e) {
      applyServerIssues(e, setError);
    }
  });

  return (
    <form noValidate onSubmit={(e) => void onSubmit(e)} aria-label="End the episode" className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-3">
        <FormField id="dc-status" label="Ends as" required error={errors.status?.message}>
          {(a11y) => (
            <select {...a11y} {...register('status')} className={inputClass}>
              <option value="discharged">{STATUS_LABELS.discharged}</option>
              <option value="lost">{STATUS_LABELS.lost}</option>
            </select>
          )}
        </FormField>
        <FormField id="dc-date" label="Last day of care" required error={errors.dischargeDate?.message}>
          {(a11y) => <input {...a11y} {...register('dischargeDate')} type="date" className={inputClass} />}
        </FormField>
        <FormField id="dc-reason" label="Reason" required error={errors.dischargeReason?.message}>
          {(a11y) => (
            <select {...a11y} {...register('dischargeReason')} className={inputClass}>
              <option value="">Choose…</option>
              {DISCHARGE_REASONS.map((r) => (
                <option key={r} value={r}>
                  {DISCHARGE_REASON_LABELS[r]}
                </option>
              ))}
            </select>
          )}
        </FormField>
      </div>
      {failure}
      <button
        type="submit"
        disabled={formState.isSubmitting}
        className="rounded border border-accent px-4 py-2 text-sm text-accent-strong hover:bg-accent-tint disabled:opacity-60"
      >
        {formState.isSubmitting ? 'Saving…' : 'End the episode'}
      </button>
    </form>
  );
}
