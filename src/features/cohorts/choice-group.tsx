/** A row of checkboxes for one criterion; nothing ticked means "any". */
export function ChoiceGroup<T extends string>({
  legend,
  options,
  labels,
  value,
  onChange,
}: {
  legend: string;
  options: readonly T[];
  labels: Record<T, string>;
  value: readonly T[];
  onChange: (next: T[]) => void;
}) {
  const toggle = (o: T) => onChange(value.includes(o) ? value.filter((v) => v !== o) : [...value, o]);
  return (
    <fieldset className="space-y-1.5">
      <legend className="text-sm font-medium text-ink">
        {legend}{' '}
        <span className="font-normal text-ink-faint">{value.length === 0 ? '(any)' : `(${value.length} chosen)`}</span>
      </legend>
      <div className="flex flex-wrap gap-1.5">
        {options.map((o) => {
          const on = value.includes(o);
          return (
            <label
              key={o}
              className={`cursor-pointer rounded border px-2 py-1 text-xs has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-accent ${on ? 'border-accent bg-accent-tint text-accent-strong' : 'border-line bg-surface text-ink-soft hover:border-accent'}`}
            >
              <input type="checkbox" className="sr-only" checked={on} onChange={() => toggle(o)} />
              {labels[o]}
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}
