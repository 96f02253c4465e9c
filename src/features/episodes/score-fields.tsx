import type { UseFormRegisterReturn } from 'react-hook-form';
import type { InstrumentInfo } from '../../../shared/schemas/reference';
import { FormField, inputClass } from '../../components/form-field';

type Props = {
  legend: string;
  idPrefix: string;
  instruments: InstrumentInfo[];
  fieldProps: (code: string) => UseFormRegisterReturn;
  errorOf: (code: string) => string | undefined;
  /** An error about the scores as a whole, e.g. "Enter at least one score". */
  groupError?: string | undefined;
};

const direction = (i: InstrumentInfo) => (i.higherIsBetter ? 'higher is better' : 'lower is better');

/** One number input per instrument, each with its range and direction; blank means "not measured". */
export function ScoreFields({ legend, idPrefix, instruments, fieldProps, errorOf, groupError }: Props) {
  return (
    <fieldset className="space-y-4" aria-describedby={groupError ? `${idPrefix}-scores-error` : undefined}>
      <legend className="text-base font-medium">{legend}</legend>
      <p className="text-xs text-ink-faint">Leave a score blank when it was not measured. Enter totals only.</p>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {instruments.map((i) => (
          <FormField
            key={i.code}
            id={`${idPrefix}-${i.code}`}
            label={i.label}
            hint={`${i.min} to ${i.max}, ${direction(i)}`}
            error={errorOf(i.code)}
          >
            {(a11y) => (
              <input
                {...a11y}
                {...fieldProps(i.code)}
                type="number"
                inputMode="decimal"
                step="any"
                min={i.min}
                max={i.max}
                className={inputClass}
              />
            )}
          </FormField>
        ))}
      </div>
      {groupError ? (
        <p id={`${idPrefix}-scores-error`} className="text-sm text-bad">
          {groupError}
        </p>
      ) : null}
    </fieldset>
  );
}
