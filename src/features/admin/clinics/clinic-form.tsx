import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ClinicCreateSchema, type ClinicCreate } from '../../../../shared/schemas/admin';
import { ErrorNotice } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { applyServerIssues, friendlyIssue } from '../../episodes/form-validation';
import { useCreateClinic } from '../api/create-clinic';
import { primaryButton } from '../components/buttons';
import { SavedNote } from '../components/panel';

/** A new clinic: short public code, the name staff know it by, and its region. */
export function ClinicCreateForm() {
  const create = useCreateClinic();
  const form = useForm<ClinicCreate>({
    resolver: zodResolver(ClinicCreateSchema, { error: friendlyIssue }),
    defaultValues: { code: '', displayName: '', region: '' },
  });
  const { register, handleSubmit, formState, setError, reset } = form;
  const errors = formState.errors;
  const onSubmit = handleSubmit(async (values) => {
    try {
      await create.mutateAsync(values);
      reset();
    } catch (e) {
      applyServerIssues(e, setError);
    }
  });
  return (
    <form noValidate onSubmit={(e) => void onSubmit(e)} aria-label="Add a clinic" className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-3">
        <FormField
          id="clinic-code"
          label="Clinic code"
          required
          hint="2–12 letters or digits; shown in place of the name to researchers"
          error={errors.code?.message}
        >
          {(a11y) => <input {...a11y} {...register('code')} className={inputClass} autoComplete="off" />}
        </FormField>
        <FormField id="clinic-name" label="Clinic name" required error={errors.displayName?.message}>
          {(a11y) => <input {...a11y} {...register('displayName')} className={inputClass} />}
        </FormField>
        <FormField id="clinic-region" label="Region" required error={errors.region?.message}>
          {(a11y) => <input {...a11y} {...register('region')} className={inputClass} />}
        </FormField>
      </div>
      {create.error && !formState.errors.code ? (
        <ErrorNotice error={create.error} title="The clinic was not added" />
      ) : null}
      {create.isSuccess && !formState.isDirty ? <SavedNote>Clinic {create.data.code} added.</SavedNote> : null}
      <button type="submit" className={primaryButton} disabled={formState.isSubmitting}>
        Add clinic
      </button>
    </form>
  );
}
