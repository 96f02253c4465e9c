import type { UseFormRegisterReturn } from 'react-hook-form';
import { signed } from './questions';

type Props = {
  name: string;
  legend: string;
  hint: string;
  low?: string;
  high?: string;
  min: number;
  max: number;
  register: UseFormRegisterReturn;
  checked: string | undefined;
  onClear: () => void;
};

/**
 * A whole-number rating as a row of large buttons: real radio inputs in a fieldset, so arrow keys, screen readers
 * and touch all work; each target is at least 48 px.
 */
export function RatingScale({ name, legend, hint, low, high, min, max, register, checked, onClear }: Props) {
  const values = Array.from({ length: max - min + 1 }, (_, i) => min + i);
  const hintId = `${name}-hint`;
  return (
    <fieldset aria-describedby={hintId} className="space-y-3">
      <legend className="text-lg font-medium text-ink">{legend}</legend>
      <p id={hintId} className="text-sm text-ink-soft">
        {hint} {low ? <span className="block">{low}</span> : null}
        {high ? <span className="block">{high}</span> : null}
      </p>
      <div
        className={`grid gap-2 ${values.length > 11 ? 'grid-cols-5 sm:grid-cols-8' : 'grid-cols-6 sm:grid-cols-11'}`}
      >
        {values.map((v) => (
          <label key={v} className="relative block">
            <input type="radio" value={String(v)} className="peer sr-only" {...register} />
            <span className="flex h-12 min-w-12 cursor-pointer select-none items-center justify-center rounded border-2 border-line bg-surface text-lg font-medium text-ink tabular peer-checked:border-accent-strong peer-checked:bg-accent-strong peer-checked:text-white peer-focus-visible:outline peer-focus-visible:outline-2 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-accent hover:border-accent">
              {signed(v, min)}
            </span>
          </label>
        ))}
      </div>
      {checked ? (
        <button type="button" onClick={onClear} className="text-sm text-accent underline">
          Clear this answer
        </button>
      ) : null}
    </fieldset>
  );
}
