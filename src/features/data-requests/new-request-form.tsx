import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { GROUP_LABELS, REQUESTABLE_GROUPS } from '../../../shared/export-columns';
import { DataRequestCreateSchema } from '../../../shared/schemas/data-request';
import { ErrorNotice } from '../../components/error-notice';
import { FormField, inputClass } from '../../components/form-field';
import { useCohorts } from '../cohorts/api/list-cohorts';
import { primaryButton } from '../cohorts/buttons';
import { useCreateDataRequest } from './api/create-data-request';

type Values = z.input<typeof DataRequestCreateSchema>;

/** A researcher's request: one of their saved cohorts (its current version), the purpose, the variables wanted. */
export function NewRequestForm() {
  const cohorts = useCohorts();
  const create = useCreateDataRequest();
  const mine = (cohorts.data?.items ?? []).filter((c) => c.mine);
  const form = useForm<Values>({
    resolver: zodResolver(DataRequestCreateSchema),
    defaultValues: { cohortId: 0, purpose: '', variableGroups: ['subgroups', 'scores', 'change', 'recovery'] },
  });
  const { register, handleSubmit, formState, reset } = form;
  const onSubmit = handleSubmit(async (v) => {
    await create.mutateAsync(v);
    reset();
  });
  if (cohorts.data && mine.length === 0) {
    return (
      <p className="text-sm text-ink-soft">Save a cohort first; a request is made from one of your saved cohorts.</p>
    );
  }
  return (
    <form noValidate onSubmit={(e) => void onSubmit(e)} aria-label="Request the data of a cohort" className="space-y-4">
      <FormField
        id="req-cohort"
        label="Cohort"
        required
        error={formState.errors.cohortId ? 'Choose one of your saved cohorts' : undefined}
      >
        {(a11y) => (
          <select {...a11y} {...register('cohortId', { valueAsNumber: true })} className={inputClass}>
            <option value={0}>Choose a saved cohort…</option>
            {mine.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name} (version {c.currentVersion})
              </option>
            ))}
          </select>
        )}
      </FormField>
      <FormField
        id="req-purpose"
        label="Purpose"
        required
        hint="What the data will be used for; the steward decides on this"
        error={formState.errors.purpose?.message}
      >
        {(a11y) => <textarea {...a11y} {...register('purpose')} rows={4} className={inputClass} />}
      </FormField>
      <fieldset className="space-y-1.5">
        <legend className="text-sm font-medium">Variables</legend>
        <p className="text-xs text-ink-faint">
          Always included: {GROUP_LABELS.core.replace(' (always included)', '').toLowerCase()}.
        </p>
        {REQUESTABLE_GROUPS.map((g) => (
          <label key={g} className="flex items-start gap-2 text-sm">
            <input type="checkbox" value={g} {...register('variableGroups')} />
            <span>{GROUP_LABELS[g]}</span>
          </label>
        ))}
      </fieldset>
      {create.error ? <ErrorNotice error={create.error} title="The request was not sent" /> : null}
      {create.isSuccess && !formState.isDirty ? (
        <p role="status" className="text-sm text-good">
          Request sent to the steward.
        </p>
      ) : null}
      <button type="submit" className={primaryButton} disabled={formState.isSubmitting}>
        Send request
      </button>
    </form>
  );
}
