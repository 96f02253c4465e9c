import type { ReactNode } from 'react';

/** Attributes a control needs so its label, hint and error are announced with it. */
export type FieldA11y = { id: string; 'aria-invalid': boolean; 'aria-describedby': string | undefined };

type Props = {
  id: string;
  label: string;
  /** Short help shown under the label, e.g. the unit or the instrument's range. */
  hint?: ReactNode;
  error?: string | undefined;
  required?: boolean;
  className?: string;
  /** Render the control with the given attributes (render prop, so any input, select or textarea fits). */
  children: (a11y: FieldA11y) => ReactNode;
};

/** Base look of text inputs and selects; red edge when invalid. */
export const inputClass =
  'tabular w-full rounded border border-line bg-surface px-3 py-2 text-sm text-ink aria-[invalid=true]:border-bad focus:border-accent focus:outline-none';

/** A labelled form field with an optional hint and its error right beside it. */
export function FormField({ id, label, hint, error, required, className = '', children }: Props) {
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={id} className="block text-sm font-medium text-ink">
        {label}
        {required ? <span className="text-ink-faint"> (required)</span> : null}
      </label>
      {hint ? (
        <p id={hintId} className="text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      {children({ id, 'aria-invalid': Boolean(error), 'aria-describedby': describedBy })}
      {error ? (
        <p id={errorId} className="text-sm text-bad">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** A checkbox with its label to the right and an optional error. */
export function CheckboxField({
  id, label, hint, error, children,
}: Omit<Props, 'required' | 'className'>) {
  const errorId = error ? `${id}-error` : undefined;
  const hintId = hint ? `${id}-hint` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <div className="space-y-1">
      <div className="flex items-start gap-2">
        {children({ id, 'aria-invalid': Boolean(error), 'aria-describedby': describedBy })}
        <label htmlFor={id} className="text-sm text-ink">
          {label}
        </label>
      </div>
      {hint ? (
        <p id={hintId} className="pl-6 text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="pl-6 text-sm text-bad">
          {error}
        </p>
      ) : null}
    </div>
  );
}
