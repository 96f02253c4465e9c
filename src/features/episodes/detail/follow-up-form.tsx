import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { TIMEPOINTS } from '../../../../shared/constants';
import type { AssessmentInput, EpisodeDetail } from '../../../../shared/schemas/episode';
import type { InstrumentInfo } from '../../../../shared/schemas/reference';
import { ErrorNotice } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { useAddAssessment } from '../api/add-assessment';
import { todayIso } from '../format';
import { applyServerIssues, numberOrBlank } from '../form-validation';
import { TIMEPOINT_LABELS } from '../labels';
import { ReporterStepsFields } from '../reporter-steps-fields';
import { ScoreFields } from '../score-fields';
import { followUpResolver, nextTimepoint, type FollowUpValues } from './follow-up-values';

const FOLLOW_UP_CHOICES = TIMEPOINTS.filter((t) => t !== 'baseline');

type Props = {
  episode: EpisodeDetail;
  instruments: InstrumentInfo[];
  /** Preselected assessment (e.g. from the follow-ups list); otherwise the next one not yet recorded. */
  timepoint?: FollowUpValues['timepoint'] | undefined;
  /** Called with the saved episode (the dedicated screen goes back to the episode then). */
  onSaved?: (episode: EpisodeDetail) => void;
};

/**
 * Adds a follow-up assessment; afterwards the history shows its change since the start. After each
 * save the fields start afresh (a new key), which clears every score input, and the next one is preselected.
 */
export function FollowUpForm(props: Props) {
  const [round, setRound] = useState(0);
  const [saved, setSaved] = useState<string | null>(null);
  // Taken from the saved answer, not from props: the cache update may reach the props a moment later.
  const [preset, setPreset] = useState(props.timepoint);
  return (
    <FollowUpFields
      key={round}
      {...props}
      timepoint={preset}
      saved={saved}
      onStart={() => setSaved(null)}
      onSaved={(episode, message) => {
        setSaved(message);
        setPreset(nextTimepoint(episode));
        setRound((r) => r + 1);
        props.onSaved?.(episode);
      }}
    />
  );
}

type FieldsProps = Omit<Props, 'onSaved'> & {
  saved: string | null;
  onStart: () => void;
  onSaved: (episode: EpisodeDetail, message: string) => void;
};

function FollowUpFields({ episode, instruments, timepoint, saved, onStart, onSaved }: FieldsProps) {
  const add = useAddAssessment(episode.id);
  const active = instruments.filter((i) => !i.retired);
  const { register, handleSubmit, setError, formState } = useForm<FollowUpValues, unknown, AssessmentInput>({
    resolver: followUpResolver(active),
    defaultValues: {
      timepoint: timepoint ?? nextTimepoint(episode),
      assessedOn: todayIso(),
      reporter: 'clinician',
      scores: {},
    },
  });
  const errors = formState.errors;

  const onSubmit = handleSubmit(async (values) => {
    onStart();
    try {
      const updated = await add.mutateAsync(values);
      onSaved(
        updated,
        `${TIMEPOINT_LABELS[values.timepoint]} saved. Its change since the start is in the table above.`,
      );
    } catch (e) {
      applyServerIssues(e, setError);
    }
  });

  return (
    <form noValidate onSubmit={(e) => void onSubmit(e)} aria-label="Add a follow-up" className="space-y-6">
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <FormField id="fu-timepoint" label="Which assessment" required error={errors.timepoint?.message}>
          {(a11y) => (
            <select {...a11y} {...register('timepoint')} className={inputClass}>
              {FOLLOW_UP_CHOICES.map((t) => (
                <option key={t} value={t}>
                  {TIMEPOINT_LABELS[t]}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <FormField id="fu-date" label="Date" required error={errors.assessedOn?.message}>
          {(a11y) => <input {...a11y} {...register('assessedOn')} type="date" className={inputClass} />}
        </FormField>
        <ReporterStepsFields
          idPrefix="fu"
          reporter={register('reporter')}
          steps={register('avgDailySteps', { setValueAs: numberOrBlank })}
          errors={{ reporter: errors.reporter?.message, steps: errors.avgDailySteps?.message }}
        />
      </div>
      <ScoreFields
        legend="Scores"
        idPrefix="fu"
        instruments={active}
        fieldProps={(code) => register(`scores.${code}`, { setValueAs: numberOrBlank })}
        errorOf={(code) => errors.scores?.[code]?.message}
        groupError={(errors.scores as { message?: string } | undefined)?.message}
      />
      {add.error && !Object.keys(errors).length ? (
        <ErrorNotice error={add.error} title="The follow-up was not saved" />
      ) : null}
      <div className="flex flex-wrap items-center gap-4">
        <button
          type="submit"
          disabled={formState.isSubmitting}
          className="rounded bg-accent px-5 py-2 text-sm font-medium text-white hover:bg-accent-strong disabled:opacity-60"
        >
          {formState.isSubmitting ? 'Saving…' : 'Save follow-up'}
        </button>
        {saved ? (
          <p role="status" className="text-sm text-good">
            {saved}
          </p>
        ) : null}
      </div>
    </form>
  );
}
