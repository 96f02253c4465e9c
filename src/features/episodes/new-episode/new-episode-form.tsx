import { useForm, useWatch } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';
import type { EpisodeCreate } from '../../../../shared/schemas/episode';
import type { InstrumentInfo, PseudonymSalt } from '../../../../shared/schemas/reference';
import { ErrorNotice } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { episodePath } from '../../../config/paths';
import { useCreateEpisode } from '../api/create-episode';
import { todayIso } from '../format';
import { applyServerIssues, numberOrBlank } from '../form-validation';
import { ReporterStepsFields } from '../reporter-steps-fields';
import { ScoreFields } from '../score-fields';
import { EpisodeFactsFields } from './episode-facts-fields';
import { newEpisodeResolver, type NewEpisodeValues } from './new-episode-form-values';
import { PseudonymPanel } from './pseudonym-panel';

type Props = { instruments: InstrumentInfo[]; salt: PseudonymSalt };

/** The new-episode form: pseudonym (made here), the episode's facts and the baseline scores. */
export function NewEpisodeForm({ instruments, salt }: Props) {
  const navigate = useNavigate();
  const create = useCreateEpisode();
  // The global rating of change describes change since the start, so it has no place at the start itself.
  const baselineInstruments = instruments.filter((i) => !i.retired && i.code !== 'groc');
  const today = todayIso();
  const form = useForm<NewEpisodeValues, unknown, EpisodeCreate>({
    resolver: newEpisodeResolver(baselineInstruments),
    defaultValues: {
      startDate: today,
      standingWork: false,
      researchConsent: false,
      baseline: { assessedOn: today, reporter: 'clinician', scores: {} },
      interventions: [],
    },
  });
  const { register, handleSubmit, setValue, setError, formState, control } = form;
  const errors = formState.errors;
  const pseudonym = useWatch({ control, name: 'pseudonym' });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const episode = await create.mutateAsync(values);
      await navigate(episodePath(episode.id));
    } catch (e) {
      applyServerIssues(e, setError);
    }
  });

  return (
    <div className="space-y-8">
      <PseudonymPanel
        salt={salt}
        pseudonym={pseudonym}
        error={
          errors.pseudonym
            ? 'Make the pseudonym before saving: enter the local identifier, then “Make pseudonym”.'
            : undefined
        }
        onPseudonym={(hex) => setValue('pseudonym', hex ?? '', { shouldValidate: formState.isSubmitted })}
      />
      <form
        noValidate
        onSubmit={(e) => void onSubmit(e)}
        className="space-y-8 rounded border border-line bg-surface p-5"
        aria-label="New episode"
      >
        <EpisodeFactsFields register={register} errors={errors} />
        <fieldset className="space-y-4">
          <legend className="text-base font-medium">Start-of-care assessment</legend>
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <FormField
              id="baseline-assessedOn"
              label="Date of the assessment"
              required
              error={errors.baseline?.assessedOn?.message}
            >
              {(a11y) => <input {...a11y} {...register('baseline.assessedOn')} type="date" className={inputClass} />}
            </FormField>
            <ReporterStepsFields
              idPrefix="baseline"
              reporter={register('baseline.reporter')}
              steps={register('baseline.avgDailySteps', { setValueAs: numberOrBlank })}
              errors={{ reporter: errors.baseline?.reporter?.message, steps: errors.baseline?.avgDailySteps?.message }}
            />
          </div>
        </fieldset>
        <ScoreFields
          legend="Scores at the start"
          idPrefix="baseline"
          instruments={baselineInstruments}
          fieldProps={(code) => register(`baseline.scores.${code}`, { setValueAs: numberOrBlank })}
          errorOf={(code) => errors.baseline?.scores?.[code]?.message}
          groupError={(errors.baseline?.scores as { message?: string } | undefined)?.message}
        />
        {create.error && !Object.keys(errors).length ? (
          <ErrorNotice error={create.error} title="The episode was not saved" />
        ) : null}
        <div className="flex items-center gap-4">
          <button
            type="submit"
            disabled={formState.isSubmitting}
            className="rounded bg-accent px-5 py-2 text-sm font-medium text-white hover:bg-accent-strong disabled:opacity-60"
          >
            {formState.isSubmitting ? 'Saving…' : 'Save episode'}
          </button>
          <p className="text-xs text-ink-faint">Only the pseudonym and the facts above are sent to the registry.</p>
        </div>
      </form>
    </div>
  );
}
