import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { CohortSaveSchema, type CohortCriteria, type CohortDetail } from '../../../shared/schemas/cohort';
import { ErrorNotice } from '../../components/error-notice';
import { FormField, inputClass } from '../../components/form-field';
import { useSaveCohort } from './api/save-cohort';
import { primaryButton } from './buttons';

const NamingSchema = CohortSaveSchema.pick({ name: true, description: true });
type Naming = z.input<typeof NamingSchema>;

type Props = {
  cohort: CohortDetail | null;
  criteria: CohortCriteria;
  onSaved: (saved: CohortDetail) => void;
  readOnly: boolean;
};

/** Names and saves the criteria: a new cohort, or a new version of the one opened. */
export function SaveCohortForm({ cohort, criteria, onSaved, readOnly }: Props) {
  const save = useSaveCohort(cohort?.id ?? null);
  const form = useForm<Naming>({
    resolver: zodResolver(NamingSchema),
    defaultValues: { name: cohort?.name ?? '', description: cohort?.description ?? '' },
  });
  const { register, handleSubmit, formState } = form;
  const onSubmit = handleSubmit(async (v) => {
    const saved = await save.mutateAsync({ name: v.name, description: v.description ?? '', criteria });
    onSaved(saved);
  });
  if (readOnly) {
    return (
      <p className="text-sm text-ink-soft">
        This cohort belongs to {cohort?.ownerName}; duplicate it to change the criteria.
      </p>
    );
  }
  return (
    <form noValidate onSubmit={(e) => void onSubmit(e)} aria-label="Save the cohort" className="space-y-3">
      <FormField id="cohort-name" label="Name" required error={formState.errors.name?.message}>
        {(a11y) => <input {...a11y} {...register('name')} className={inputClass} />}
      </FormField>
      <FormField
        id="cohort-description"
        label="Description"
        hint="What the cohort is for; researchers and the steward see it"
        error={formState.errors.description?.message}
      >
        {(a11y) => <textarea {...a11y} {...register('description')} rows={3} className={inputClass} />}
      </FormField>
      {save.error ? <ErrorNotice error={save.error} title="The cohort was not saved" /> : null}
      <button type="submit" className={primaryButton} disabled={formState.isSubmitting}>
        {cohort ? `Save as version ${cohort.currentVersion + 1}` : 'Save cohort'}
      </button>
    </form>
  );
}
