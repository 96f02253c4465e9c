import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { CodeCreateSchema, type CodeCreate } from '../../../../shared/schemas/admin';
import { INTERVENTION_KINDS } from '../../../../shared/constants';
import { ErrorNotice } from '../../../components/error-notice';
import { CheckboxField, FormField, inputClass } from '../../../components/form-field';
import { applyServerIssues, friendlyIssue } from '../../episodes/form-validation';
import { primaryButton } from '../components/buttons';
import { SavedNote } from '../components/panel';
import { KIND_WORDS } from './code-words';

type Props = {
  /** 'add' for the steward (accepted at once), 'propose' for a lead (waits for the steward). */
  mode: 'add' | 'propose';
  submit: (input: CodeCreate) => Promise<unknown>;
  error: unknown;
  saved: boolean;
};

/** A new intervention code: code, label, kind and whether it is graded in levels 1–3. */
export function CodeForm({ mode, submit, error, saved }: Props) {
  const form = useForm<z.input<typeof CodeCreateSchema>, unknown, CodeCreate>({
    resolver: zodResolver(CodeCreateSchema, { error: friendlyIssue }),
    defaultValues: { code: '', label: '', kind: 'addon', graded: false },
  });
  const { register, handleSubmit, formState, setError, reset } = form;
  const errors = formState.errors;
  const onSubmit = handleSubmit(async (v) => {
    try {
      await submit(v);
      reset();
    } catch (e) {
      applyServerIssues(e, setError);
    }
  });
  return (
    <form
      noValidate
      onSubmit={(e) => void onSubmit(e)}
      aria-label={mode === 'add' ? 'Add a code' : 'Propose a code'}
      className="space-y-4"
    >
      <div className="grid gap-4 sm:grid-cols-3">
        <FormField
          id={`${mode}-code`}
          label="Code"
          required
          hint="Lower-case letters, digits and hyphens"
          error={errors.code?.message}
        >
          {(a11y) => <input {...a11y} {...register('code')} autoComplete="off" className={inputClass} />}
        </FormField>
        <FormField id={`${mode}-label`} label="Label" required error={errors.label?.message}>
          {(a11y) => <input {...a11y} {...register('label')} className={inputClass} />}
        </FormField>
        <FormField id={`${mode}-kind`} label="Kind" error={errors.kind?.message}>
          {(a11y) => (
            <select {...a11y} {...register('kind')} className={inputClass}>
              {INTERVENTION_KINDS.map((k) => (
                <option key={k} value={k}>
                  {KIND_WORDS[k]}
                </option>
              ))}
            </select>
          )}
        </FormField>
      </div>
      <CheckboxField id={`${mode}-graded`} label="Graded: clinicians record the highest level reached (1–3)">
        {(a11y) => <input {...a11y} {...register('graded')} type="checkbox" className="mt-1" />}
      </CheckboxField>
      {error && !errors.code ? (
        <ErrorNotice error={error} title={mode === 'add' ? 'The code was not added' : 'The proposal was not sent'} />
      ) : null}
      {saved && !formState.isDirty ? (
        <SavedNote>{mode === 'add' ? 'Code added.' : 'Proposal sent to the registry steward.'}</SavedNote>
      ) : null}
      <button type="submit" className={primaryButton} disabled={formState.isSubmitting}>
        {mode === 'add' ? 'Add code' : 'Send proposal'}
      </button>
    </form>
  );
}
