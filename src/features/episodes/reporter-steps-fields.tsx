import type { UseFormRegisterReturn } from 'react-hook-form';
import { REPORTERS } from '../../../shared/constants';
import { FormField, inputClass } from '../../components/form-field';
import { REPORTER_LABELS } from './labels';

type Props = {
  idPrefix: string;
  reporter: UseFormRegisterReturn;
  steps: UseFormRegisterReturn;
  errors: { reporter?: string; steps?: string };
};

/** Who reported an assessment's scores and the optional daily steps: the same two fields at baseline and follow-up. */
export function ReporterStepsFields({ idPrefix, reporter, steps, errors }: Props) {
  return (
    <>
      <FormField id={`${idPrefix}-reporter`} label="Who reported the scores" error={errors.reporter}>
        {(a11y) => (
          <select {...a11y} {...reporter} className={inputClass}>
            {REPORTERS.map((r) => (
              <option key={r} value={r}>
                {REPORTER_LABELS[r]}
              </option>
            ))}
          </select>
        )}
      </FormField>
      <FormField
        id={`${idPrefix}-steps`}
        label="Average daily steps"
        hint="If measured; 0 to 100,000"
        error={errors.steps}
      >
        {(a11y) => <input {...a11y} {...steps} type="number" inputMode="numeric" className={inputClass} />}
      </FormField>
    </>
  );
}
