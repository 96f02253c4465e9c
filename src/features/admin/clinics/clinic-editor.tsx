import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ClinicPatchSchema, type ClinicPatch, type ClinicSummary } from '../../../../shared/schemas/admin';
import { ErrorNotice } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { applyServerIssues, friendlyIssue } from '../../episodes/form-validation';
import { useSetClinicActive } from '../api/set-clinic-active';
import { useUpdateClinic } from '../api/update-clinic';
import { primaryButton, quietButton } from '../components/buttons';
import { ConfirmButton } from '../components/confirm-button';

/** Rename, move to another region, deactivate or reactivate one clinic. */
export function ClinicEditor({ clinic, onDone }: { clinic: ClinicSummary; onDone: () => void }) {
  const update = useUpdateClinic();
  const setActive = useSetClinicActive();
  const form = useForm<ClinicPatch>({
    resolver: zodResolver(ClinicPatchSchema, { error: friendlyIssue }),
    defaultValues: { displayName: clinic.displayName, region: clinic.region },
  });
  const { register, handleSubmit, formState, setError } = form;
  const onSubmit = handleSubmit(async (values) => {
    try {
      await update.mutateAsync({ id: clinic.id, patch: values });
      onDone();
    } catch (e) {
      applyServerIssues(e, setError);
    }
  });
  return (
    <div className="space-y-4 rounded border border-accent/40 bg-accent-tint/40 p-4">
      <form
        noValidate
        onSubmit={(e) => void onSubmit(e)}
        aria-label={`Edit clinic ${clinic.code}`}
        className="space-y-3"
      >
        <div className="grid gap-4 sm:grid-cols-2">
          <FormField id={`edit-name-${clinic.id}`} label="Clinic name" error={formState.errors.displayName?.message}>
            {(a11y) => <input {...a11y} {...register('displayName')} className={inputClass} />}
          </FormField>
          <FormField id={`edit-region-${clinic.id}`} label="Region" error={formState.errors.region?.message}>
            {(a11y) => <input {...a11y} {...register('region')} className={inputClass} />}
          </FormField>
        </div>
        {update.error ? <ErrorNotice error={update.error} title="The change was not saved" /> : null}
        <div className="flex gap-2">
          <button type="submit" className={primaryButton} disabled={formState.isSubmitting}>
            Save
          </button>
          <button type="button" className={quietButton} onClick={onDone}>
            Cancel
          </button>
        </div>
      </form>
      <div className="border-t border-line pt-3">
        {clinic.active ? (
          <ConfirmButton
            label="Deactivate clinic"
            confirmLabel={`Deactivate ${clinic.code}`}
            busy={setActive.isPending}
            consequence={`${clinic.code} keeps its ${clinic.episodes} episodes, stops accepting new episodes, follow-ups and uploads, and no longer appears among peers in clinic comparisons.`}
            onConfirm={() => setActive.mutate({ id: clinic.id, active: false })}
          />
        ) : (
          <button
            type="button"
            className={quietButton}
            onClick={() => setActive.mutate({ id: clinic.id, active: true })}
          >
            Reactivate clinic
          </button>
        )}
        {setActive.error ? <ErrorNotice error={setActive.error} title="The clinic's state did not change" /> : null}
      </div>
    </div>
  );
}
