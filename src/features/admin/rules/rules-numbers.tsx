import { Controller, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import { FOLLOW_UP_TIMEPOINTS } from '../../../../shared/constants';
import { FormField, inputClass } from '../../../components/form-field';
import type { RulesFormValues } from './rules-form-values';

type Props = {
  register: UseFormRegister<RulesFormValues>;
  control: Control<RulesFormValues>;
  errors: FieldErrors<RulesFormValues>;
};

const num = { valueAsNumber: true } as const;
const WEEK_LABEL = { week6: 'Week 6', week12: 'Week 12', week26: 'Week 26' } as const;
type ShareName = 'rules.targets.recoveredByWeek12' | 'rules.targets.respondersAtWeek12' | 'rules.completenessTarget';

/** A share (0–1) typed as a percentage. */
function PercentField({
  control,
  name,
  id,
  label,
  hint,
  error,
}: {
  control: Control<RulesFormValues>;
  name: ShareName;
  id: string;
  label: string;
  hint?: string;
  error?: string;
}) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => (
        <FormField id={id} label={label} hint={hint} error={error}>
          {(a11y) => (
            <div className="flex items-center gap-2">
              <input
                {...a11y}
                type="number"
                step="any"
                className={inputClass}
                value={Number.isFinite(field.value) ? Math.round(field.value * 1000) / 10 : ''}
                onChange={(e) => field.onChange(e.target.value === '' ? Number.NaN : Number(e.target.value) / 100)}
                onBlur={field.onBlur}
              />
              <span aria-hidden className="text-sm text-ink-soft">
                %
              </span>
            </div>
          )}
        </FormField>
      )}
    />
  );
}

/** Windows, targets and the small-number limits of the rules form. */
export function RulesNumbers({ register, control, errors }: Props) {
  const r = errors.rules;
  return (
    <>
      <fieldset className="space-y-3">
        <legend className="text-base font-medium">Primary follow-up (weeks since the start of care)</legend>
        <p className="text-sm text-ink-soft">
          Change scores and responders use the assessment nearest the target week inside this window.
        </p>
        {r?.primaryWindow?.root?.message || r?.primaryWindow?.message ? (
          <p className="text-sm text-bad">{r.primaryWindow.root?.message ?? r.primaryWindow.message}</p>
        ) : null}
        <div className="grid gap-4 sm:grid-cols-3">
          <FormField id="rules-pw-from" label="First week" error={r?.primaryWindow?.fromWeek?.message}>
            {(a11y) => (
              <input
                {...a11y}
                {...register('rules.primaryWindow.fromWeek', num)}
                type="number"
                className={inputClass}
              />
            )}
          </FormField>
          <FormField id="rules-pw-target" label="Target week" error={r?.primaryWindow?.targetWeek?.message}>
            {(a11y) => (
              <input
                {...a11y}
                {...register('rules.primaryWindow.targetWeek', num)}
                type="number"
                className={inputClass}
              />
            )}
          </FormField>
          <FormField id="rules-pw-to" label="Last week" error={r?.primaryWindow?.toWeek?.message}>
            {(a11y) => (
              <input {...a11y} {...register('rules.primaryWindow.toWeek', num)} type="number" className={inputClass} />
            )}
          </FormField>
        </div>
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-base font-medium">
          Scheduled follow-ups (days since the start, both ends included)
        </legend>
        {r?.followUpWindows?.message ? <p className="text-sm text-bad">{r.followUpWindows.message}</p> : null}
        <div className="grid gap-4 sm:grid-cols-3">
          {FOLLOW_UP_TIMEPOINTS.map((t) => (
            // Each window is its own group, so "From day" is announced with its week.
            <fieldset key={t} className="space-y-2 rounded border border-line p-3">
              <legend className="px-1 text-sm font-medium">{WEEK_LABEL[t]}</legend>
              <div className="grid grid-cols-2 gap-2">
                <FormField id={`rules-${t}-from`} label="From day" error={r?.followUpWindows?.[t]?.fromDay?.message}>
                  {(a11y) => (
                    <input
                      {...a11y}
                      {...register(`rules.followUpWindows.${t}.fromDay`, num)}
                      type="number"
                      className={inputClass}
                    />
                  )}
                </FormField>
                <FormField
                  id={`rules-${t}-to`}
                  label="To day"
                  error={r?.followUpWindows?.[t]?.toDay?.message ?? r?.followUpWindows?.[t]?.message}
                >
                  {(a11y) => (
                    <input
                      {...a11y}
                      {...register(`rules.followUpWindows.${t}.toDay`, num)}
                      type="number"
                      className={inputClass}
                    />
                  )}
                </FormField>
              </div>
            </fieldset>
          ))}
        </div>
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-base font-medium">Three-month expectation and completeness</legend>
        <p className="text-sm text-ink-soft">
          Registry settings the clinics’ results are compared with; they are not published norms.
        </p>
        <div className="grid gap-4 sm:grid-cols-3">
          <PercentField
            control={control}
            name="rules.targets.recoveredByWeek12"
            id="rules-target-recovered"
            label="Recovered by week 12"
            error={r?.targets?.recoveredByWeek12?.message}
          />
          <PercentField
            control={control}
            name="rules.targets.respondersAtWeek12"
            id="rules-target-responders"
            label="Responders at week 12"
            error={r?.targets?.respondersAtWeek12?.message}
          />
          <PercentField
            control={control}
            name="rules.completenessTarget"
            id="rules-completeness"
            label="Follow-up completeness"
            error={r?.completenessTarget?.message}
          />
        </div>
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-base font-medium">Small numbers</legend>
        <div className="grid gap-4 sm:grid-cols-3">
          <FormField
            id="rules-min-estimate"
            label="Smallest group with an estimate"
            hint="Smaller groups show counts only"
            error={r?.minCellEstimate?.message}
          >
            {(a11y) => (
              <input {...a11y} {...register('rules.minCellEstimate', num)} type="number" className={inputClass} />
            )}
          </FormField>
          <FormField
            id="rules-min-researcher"
            label="Smallest count shown to researchers"
            hint="Smaller counts read “fewer than”"
            error={r?.minCellResearcher?.message}
          >
            {(a11y) => (
              <input {...a11y} {...register('rules.minCellResearcher', num)} type="number" className={inputClass} />
            )}
          </FormField>
          <FormField
            id="rules-export-k"
            label="Export k"
            hint="Every combination of quasi-identifiers in an export is shared by at least k people; never below 3"
            error={r?.exportK?.message}
          >
            {(a11y) => (
              <input {...a11y} {...register('rules.exportK', num)} type="number" min={3} className={inputClass} />
            )}
          </FormField>
        </div>
      </fieldset>
    </>
  );
}
