import { ACTIVITY_PROFILES, BMI_BANDS, DURATION_BANDS, SEXES } from '../../../shared/constants';
import { AGE_BANDS, type CohortCriteria } from '../../../shared/schemas/cohort';
import { inputClass } from '../../components/form-field';
import { useInstruments } from '../reference/api/get-instruments';
import { useInterventions } from '../reference/api/get-interventions';
import { ChoiceGroup } from './choice-group';
import { ACTIVITY_LABELS, AGE_LABELS, BMI_LABELS, CONDITIONS, DURATION_LABELS, SEX_LABELS } from './labels';

type Props = { value: CohortCriteria; onChange: (next: CohortCriteria) => void };

const label = 'block text-sm font-medium text-ink';

/** The cohort's criteria; every change goes straight to the (debounced) live preview. */
export function CriteriaForm({ value, onChange }: Props) {
  const instruments = useInstruments();
  const interventions = useInterventions();
  const set = <K extends keyof CohortCriteria>(key: K, v: CohortCriteria[K]) => onChange({ ...value, [key]: v });
  const addOnCodes = (interventions.data?.items ?? []).filter((i) => i.kind === 'addon');
  const addOnLabels = Object.fromEntries(addOnCodes.map((i) => [i.code, i.label]));
  const pain = value.baselinePain;
  return (
    <form className="space-y-5" onSubmit={(e) => e.preventDefault()} aria-label="Cohort criteria">
      <div className="rounded border border-line bg-canvas px-3 py-2 text-sm">
        <label className="flex items-start gap-2">
          <input type="checkbox" checked disabled aria-describedby="consent-hint" />
          <span>Research consent given</span>
        </label>
        <p id="consent-hint" className="pl-6 text-xs text-ink-faint">
          Always on: an episode without research consent never enters a cohort.
        </p>
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        <div className="space-y-1">
          <label htmlFor="c-condition" className={label}>
            Condition
          </label>
          <select
            id="c-condition"
            className={inputClass}
            value={value.conditionCode ?? ''}
            onChange={(e) => set('conditionCode', e.target.value || null)}
          >
            <option value="">Any condition</option>
            {CONDITIONS.map((c) => (
              <option key={c.code} value={c.code}>
                {c.label}
              </option>
            ))}
            {value.conditionCode && !CONDITIONS.some((c) => c.code === value.conditionCode) ? (
              <option value={value.conditionCode}>{value.conditionCode}</option>
            ) : null}
          </select>
        </div>
        <div className="space-y-1">
          <label htmlFor="c-from" className={label}>
            Started on or after
          </label>
          <input
            id="c-from"
            type="date"
            className={inputClass}
            value={value.startFrom ?? ''}
            onChange={(e) => set('startFrom', e.target.value || null)}
          />
        </div>
        <div className="space-y-1">
          <label htmlFor="c-to" className={label}>
            Started on or before
          </label>
          <input
            id="c-to"
            type="date"
            className={inputClass}
            value={value.startTo ?? ''}
            onChange={(e) => set('startTo', e.target.value || null)}
          />
        </div>
      </div>
      <ChoiceGroup
        legend="Activity profile"
        options={ACTIVITY_PROFILES}
        labels={ACTIVITY_LABELS}
        value={value.activityProfiles}
        onChange={(v) => set('activityProfiles', v)}
      />
      <ChoiceGroup
        legend="BMI band (WHO)"
        options={BMI_BANDS}
        labels={BMI_LABELS}
        value={value.bmiBands}
        onChange={(v) => set('bmiBands', v)}
      />
      <ChoiceGroup
        legend="Age band"
        options={AGE_BANDS}
        labels={AGE_LABELS}
        value={value.ageBands}
        onChange={(v) => set('ageBands', v)}
      />
      <ChoiceGroup
        legend="Sex"
        options={SEXES}
        labels={SEX_LABELS}
        value={value.sexes}
        onChange={(v) => set('sexes', v)}
      />
      <ChoiceGroup
        legend="Symptom duration at the start"
        options={DURATION_BANDS}
        labels={DURATION_LABELS}
        value={value.durationBands}
        onChange={(v) => set('durationBands', v)}
      />
      <fieldset className="space-y-1.5">
        <legend className={label}>First-step pain at baseline (0–10)</legend>
        <label className="flex items-center gap-2 text-sm">
          <input
            type="checkbox"
            checked={pain !== null}
            onChange={(e) => set('baselinePain', e.target.checked ? { min: 0, max: 10 } : null)}
          />
          Limit to a range
        </label>
        {pain ? (
          <div className="flex items-center gap-2 text-sm">
            <label htmlFor="c-pain-min" className="sr-only">
              Lowest
            </label>
            <input
              id="c-pain-min"
              type="number"
              min={0}
              max={10}
              step={1}
              className={`${inputClass} w-20`}
              value={pain.min}
              onChange={(e) => set('baselinePain', { ...pain, min: Number(e.target.value) })}
            />
            <span>to</span>
            <label htmlFor="c-pain-max" className="sr-only">
              Highest
            </label>
            <input
              id="c-pain-max"
              type="number"
              min={0}
              max={10}
              step={1}
              className={`${inputClass} w-20`}
              value={pain.max}
              onChange={(e) => set('baselinePain', { ...pain, max: Number(e.target.value) })}
            />
          </div>
        ) : null}
      </fieldset>
      <div className="space-y-1">
        <label htmlFor="c-complete" className={label}>
          Needs a baseline and a primary follow-up on
        </label>
        <select
          id="c-complete"
          className={inputClass}
          value={value.completeInstrument ?? ''}
          onChange={(e) => set('completeInstrument', e.target.value || null)}
        >
          <option value="">No such requirement</option>
          {(instruments.data?.items ?? [])
            .filter((i) => !i.retired)
            .map((i) => (
              <option key={i.code} value={i.code}>
                {i.label}
              </option>
            ))}
        </select>
      </div>
      {addOnCodes.length ? (
        <div className="space-y-2">
          <ChoiceGroup
            legend="Add-ons received"
            options={addOnCodes.map((i) => i.code)}
            labels={addOnLabels}
            value={value.addOns?.codes ?? []}
            onChange={(codes) => set('addOns', codes.length ? { codes, match: value.addOns?.match ?? 'any' } : null)}
          />
          {value.addOns ? (
            <label className="flex items-center gap-2 text-sm">
              <span>Received</span>
              <select
                className={`${inputClass} w-auto`}
                value={value.addOns.match}
                onChange={(e) => set('addOns', { codes: value.addOns!.codes, match: e.target.value as 'any' | 'all' })}
              >
                <option value="any">any of these</option>
                <option value="all">all of these</option>
              </select>
            </label>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}
