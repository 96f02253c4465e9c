import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { InstrumentCreateSchema, type InstrumentCreate } from '../../../../shared/schemas/admin';
import { ErrorNotice } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { applyServerIssues, friendlyIssue, numberOrBlank } from '../../episodes/form-validation';
import { useChangeInstrument } from '../api/change-instrument';
import { primaryButton } from '../components/buttons';
import { SavedNote } from '../components/panel';
import { InstrumentFields } from './instrument-fields';

/** A new outcome measure: totals only (never items or their wording), with its MCID and where it was published. */
export function InstrumentCreateForm() {
  const change = useChangeInstrument();
  const form = useForm<InstrumentCreate>({
    resolver: zodResolver(InstrumentCreateSchema, { error: friendlyIssue }),
    defaultValues: {
      code: '',
      label: '',
      unit: 'points',
      higherIsBetter: false,
      mcid: null,
      mcidSource: '',
      bodyRegion: '',
    },
  });
  const { register, handleSubmit, formState, setError, reset } = form;
  const errors = formState.errors;
  const onSubmit = handleSubmit(async (input) => {
    try {
      await change.mutateAsync({ kind: 'create', input });
      reset();
    } catch (e) {
      applyServerIssues(e, setError);
    }
  });
  return (
    <form noValidate onSubmit={(e) => void onSubmit(e)} aria-label="Add an instrument" className="space-y-4">
      <FormField
        id="new-instrument-code"
        label="Code"
        required
        hint="Lower-case letters, digits and hyphens, e.g. foot-function-index"
        error={errors.code?.message}
      >
        {(a11y) => <input {...a11y} {...register('code')} autoComplete="off" className={`${inputClass} max-w-xs`} />}
      </FormField>
      <InstrumentFields register={register} errors={errors} idPrefix="new-instrument" />
      <div className="grid gap-4 sm:grid-cols-3">
        <FormField
          id="new-instrument-mcid"
          label="MCID (points)"
          hint="Leave empty when the measure has none"
          error={errors.mcid?.message}
        >
          {(a11y) => (
            <input
              {...a11y}
              {...register('mcid', { setValueAs: (v) => numberOrBlank(v) ?? null })}
              type="number"
              step="any"
              className={inputClass}
            />
          )}
        </FormField>
        <FormField
          id="new-instrument-source"
          label="Published source of the MCID"
          required
          className="sm:col-span-2"
          error={errors.mcidSource?.message}
        >
          {(a11y) => <input {...a11y} {...register('mcidSource')} className={inputClass} />}
        </FormField>
      </div>
      {change.error ? <ErrorNotice error={change.error} title="The instrument was not added" /> : null}
      {change.isSuccess && !formState.isDirty ? <SavedNote>Instrument added.</SavedNote> : null}
      <button type="submit" className={primaryButton} disabled={formState.isSubmitting}>
        Add instrument
      </button>
    </form>
  );
}
