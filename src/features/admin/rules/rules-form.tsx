import { useForm, useWatch } from 'react-hook-form';
import type { Instrument, RulesVersion } from '../../../../shared/schemas/admin';
import { ErrorNotice } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { applyServerIssues } from '../../episodes/form-validation';
import { useUpdateRules } from '../api/update-rules';
import { primaryButton } from '../components/buttons';
import { SavedNote } from '../components/panel';
import { rulesResolver, type RulesFormValues } from './rules-form-values';
import { RulesNumbers } from './rules-numbers';

const STALE =
  'Another steward saved a newer version while you were editing. Reload the page to see it, then make your change again.';

/** The registry's rules as one form; saving stores a new version and keeps the old one. */
export function RulesForm({ current, instruments }: { current: RulesVersion; instruments: Instrument[] }) {
  const update = useUpdateRules();
  const form = useForm<RulesFormValues>({
    resolver: rulesResolver,
    defaultValues: { rules: current.rules, reason: '', baseVersion: current.version },
  });
  const { register, handleSubmit, formState, setError, control, reset } = form;
  const errors = formState.errors;
  const code = useWatch({ control, name: 'rules.recovery.instrumentCode' });
  const recovery = instruments.find((i) => i.code === code);
  const usable = instruments.filter((i) => !i.retired || i.code === current.rules.recovery.instrumentCode);

  const onSubmit = handleSubmit(async (values) => {
    try {
      const saved = await update.mutateAsync(values);
      reset({ rules: saved.rules, reason: '', baseVersion: saved.version });
    } catch (e) {
      applyServerIssues(e, setError);
    }
  });

  return (
    <form noValidate onSubmit={(e) => void onSubmit(e)} aria-label="Registry rules" className="space-y-6">
      <fieldset className="space-y-3">
        <legend className="text-base font-medium">Recovery</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <FormField
            id="rules-recovery-instrument"
            label="Recovery instrument"
            error={errors.rules?.recovery?.instrumentCode?.message}
          >
            {(a11y) => (
              <select {...a11y} {...register('rules.recovery.instrumentCode')} className={inputClass}>
                {usable.map((i) => (
                  <option key={i.code} value={i.code}>
                    {i.label}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <FormField
            id="rules-recovery-threshold"
            label="Recovery threshold"
            hint={
              recovery
                ? `Recovered at the first follow-up scoring ${recovery.higherIsBetter ? 'at or above' : 'at or below'} this (range ${recovery.min}–${recovery.max})`
                : undefined
            }
            error={errors.rules?.recovery?.threshold?.message}
          >
            {(a11y) => (
              <input
                {...a11y}
                {...register('rules.recovery.threshold', { valueAsNumber: true })}
                type="number"
                step="any"
                className={inputClass}
              />
            )}
          </FormField>
        </div>
      </fieldset>
      <RulesNumbers register={register} control={control} errors={errors} />
      <FormField
        id="rules-reason"
        label="Why this change"
        required
        hint="Kept with the new version and shown in its history"
        error={errors.reason?.message}
      >
        {(a11y) => <textarea {...a11y} {...register('reason')} rows={2} className={inputClass} />}
      </FormField>
      {update.error ? <ErrorNotice error={update.error} title="The rules were not saved" conflict={STALE} /> : null}
      {update.isSuccess && !formState.isDirty ? (
        <SavedNote>Saved as version {update.data.version}; dashboards now use it.</SavedNote>
      ) : null}
      <button type="submit" className={primaryButton} disabled={formState.isSubmitting}>
        Save as a new version
      </button>
    </form>
  );
}
