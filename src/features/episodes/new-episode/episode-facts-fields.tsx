import type { ComponentProps } from 'react';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { ACTIVITY_PROFILES, SEXES, SIDES } from '../../../../shared/constants';
import { CheckboxField, FormField, inputClass } from '../../../components/form-field';
import { numberOrBlank } from '../form-validation';
import { ACTIVITY_LABELS, optionsOf, SEX_LABELS, SIDE_LABELS } from '../labels';
import type { NewEpisodeValues } from './new-episode-form-values';

type Props = { register: UseFormRegister<NewEpisodeValues>; errors: FieldErrors<NewEpisodeValues> };

function Select({ options, ...rest }: { options: { value: string; label: string }[] } & ComponentProps<'select'>) {
  return (
    <select {...rest} className={inputClass}>
      <option value="">Choose…</option>
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </select>
  );
}

const num = { setValueAs: numberOrBlank };

/** The episode's facts: reference, dates, body measures and subgroup facts (no direct identifiers). */
export function EpisodeFactsFields({ register, errors }: Props) {
  return (
    <fieldset className="space-y-4">
      <legend className="text-base font-medium">About the episode</legend>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <FormField
          id="reference"
          label="Episode reference"
          required
          hint="Your clinic’s own code, e.g. HB-0153. Never a name, phone number or date."
          error={errors.reference?.message}
        >
          {(a11y) => <input {...a11y} {...register('reference')} autoComplete="off" className={inputClass} />}
        </FormField>
        <FormField id="startDate" label="First day of care" required error={errors.startDate?.message}>
          {(a11y) => <input {...a11y} {...register('startDate')} type="date" className={inputClass} />}
        </FormField>
        <FormField id="side" label="Affected heel" required error={errors.side?.message}>
          {(a11y) => <Select {...a11y} {...register('side')} options={optionsOf(SIDES, SIDE_LABELS)} />}
        </FormField>
        <FormField
          id="symptomWeeks"
          label="Weeks of symptoms before the start"
          required
          hint="0 to 1040 weeks"
          error={errors.symptomWeeks?.message}
        >
          {(a11y) => (
            <input
              {...a11y}
              {...register('symptomWeeks', num)}
              type="number"
              inputMode="numeric"
              className={inputClass}
            />
          )}
        </FormField>
        <FormField
          id="ageYears"
          label="Age in years"
          required
          hint="Adults, 16 to 110"
          error={errors.ageYears?.message}
        >
          {(a11y) => (
            <input {...a11y} {...register('ageYears', num)} type="number" inputMode="numeric" className={inputClass} />
          )}
        </FormField>
        <FormField id="sex" label="Sex" required error={errors.sex?.message}>
          {(a11y) => <Select {...a11y} {...register('sex')} options={optionsOf(SEXES, SEX_LABELS)} />}
        </FormField>
        <FormField
          id="heightCm"
          label="Height (cm)"
          required
          hint="100 to 230; BMI is worked out from height and weight"
          error={errors.heightCm?.message}
        >
          {(a11y) => (
            <input
              {...a11y}
              {...register('heightCm', num)}
              type="number"
              inputMode="decimal"
              step="any"
              className={inputClass}
            />
          )}
        </FormField>
        <FormField id="weightKg" label="Weight (kg)" required hint="30 to 300" error={errors.weightKg?.message}>
          {(a11y) => (
            <input
              {...a11y}
              {...register('weightKg', num)}
              type="number"
              inputMode="decimal"
              step="any"
              className={inputClass}
            />
          )}
        </FormField>
        <FormField id="activityProfile" label="Activity group" required error={errors.activityProfile?.message}>
          {(a11y) => (
            <Select
              {...a11y}
              {...register('activityProfile')}
              options={optionsOf(ACTIVITY_PROFILES, ACTIVITY_LABELS)}
            />
          )}
        </FormField>
      </div>
      <div className="space-y-2">
        <CheckboxField
          id="standingWork"
          label="Stands for most of the working day"
          error={errors.standingWork?.message}
        >
          {(a11y) => <input {...a11y} {...register('standingWork')} type="checkbox" className="mt-1 accent-accent" />}
        </CheckboxField>
        <CheckboxField
          id="researchConsent"
          label="Agreed that the de-identified record may be used for research"
          error={errors.researchConsent?.message}
        >
          {(a11y) => (
            <input {...a11y} {...register('researchConsent')} type="checkbox" className="mt-1 accent-accent" />
          )}
        </CheckboxField>
      </div>
    </fieldset>
  );
}
