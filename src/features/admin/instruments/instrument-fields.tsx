import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { FormField, inputClass } from '../../../components/form-field';

/** The descriptive fields shared by the new-instrument form and the editor. */
export type InstrumentFieldValues = {
  label: string;
  unit: string;
  min: number;
  max: number;
  higherIsBetter: boolean;
  bodyRegion: string;
};

type Props<T extends InstrumentFieldValues> = {
  register: UseFormRegister<T>;
  errors: FieldErrors<T>;
  idPrefix: string;
  rangeHint?: string;
};

export function InstrumentFields<T extends InstrumentFieldValues>({ register, errors, idPrefix, rangeHint }: Props<T>) {
  // react-hook-form's generic paths cannot be narrowed from T; the names below exist on every T.
  const reg = register as unknown as UseFormRegister<InstrumentFieldValues>;
  const err = errors as FieldErrors<InstrumentFieldValues>;
  return (
    <div className="grid gap-4 sm:grid-cols-3">
      <FormField id={`${idPrefix}-label`} label="Label" required error={err.label?.message} className="sm:col-span-2">
        {(a11y) => <input {...a11y} {...reg('label')} className={inputClass} />}
      </FormField>
      <FormField id={`${idPrefix}-unit`} label="Unit" required error={err.unit?.message}>
        {(a11y) => <input {...a11y} {...reg('unit')} className={inputClass} />}
      </FormField>
      <FormField id={`${idPrefix}-min`} label="Lowest score" hint={rangeHint} error={err.min?.message}>
        {(a11y) => (
          <input {...a11y} {...reg('min', { valueAsNumber: true })} type="number" step="any" className={inputClass} />
        )}
      </FormField>
      <FormField id={`${idPrefix}-max`} label="Highest score" error={err.max?.message}>
        {(a11y) => (
          <input {...a11y} {...reg('max', { valueAsNumber: true })} type="number" step="any" className={inputClass} />
        )}
      </FormField>
      <FormField id={`${idPrefix}-direction`} label="A better state is" error={err.higherIsBetter?.message}>
        {(a11y) => (
          <select
            {...a11y}
            {...reg('higherIsBetter', { setValueAs: (v) => v === true || v === 'true' })}
            className={inputClass}
          >
            <option value="false">a lower score (e.g. pain)</option>
            <option value="true">a higher score (e.g. function)</option>
          </select>
        )}
      </FormField>
      <FormField id={`${idPrefix}-region`} label="Body region" required error={err.bodyRegion?.message}>
        {(a11y) => <input {...a11y} {...reg('bodyRegion')} className={inputClass} />}
      </FormField>
    </div>
  );
}
