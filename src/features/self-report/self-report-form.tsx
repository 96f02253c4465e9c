import { useForm, useWatch } from 'react-hook-form';
import type {
  SelfReportForm as FormSpec,
  SelfReportQuestion,
  SelfReportSubmit,
} from '../../../shared/schemas/follow-ups';
import { ErrorNotice } from '../../components/error-notice';
import { useSubmitSelfReport } from './api/submit-self-report';
import { QUESTION_WORDS, STEPS_WORDS } from './questions';
import { RatingScale } from './rating-scale';

type Values = { scores: Record<string, string>; steps: string };

const field = (q: SelfReportQuestion) => `scores.${q.code}` as const;
const inputClass =
  'tabular w-full max-w-xs rounded border-2 border-line bg-surface px-4 py-3 text-lg text-ink focus:border-accent focus:outline-none aria-[invalid=true]:border-bad';

/** Turns the typed answers into the request; blanks are left out (every question may be skipped). */
function toSubmit(v: Values): SelfReportSubmit {
  const scores: Record<string, number> = {};
  for (const [code, raw] of Object.entries(v.scores ?? {})) {
    if (raw !== '' && raw != null) scores[code] = Number(String(raw).replace(',', '.'));
  }
  const steps = v.steps.trim();
  return { scores, avgDailySteps: steps === '' ? null : Number(steps) };
}

function numberRule(q: SelfReportQuestion) {
  return (raw: string) => {
    if (raw === '' || raw == null) return true;
    const n = Number(String(raw).replace(',', '.'));
    if (!Number.isFinite(n) || n < q.min || n > q.max)
      return `Enter a number from ${q.min} to ${q.max}, or leave it empty`;
    if (q.step === 1 && !Number.isInteger(n)) return 'Enter a whole number';
    if (Math.abs(Math.round(n * 10) - n * 10) > 1e-9) return 'Use at most one decimal';
    return true;
  };
}

/** The patient's answers: totals only, every question optional, at least one rating needed. */
export function SelfReportForm({ token, spec, onDone }: { token: string; spec: FormSpec; onDone: () => void }) {
  const submit = useSubmitSelfReport(token);
  const { register, handleSubmit, control, setValue, setError, formState } = useForm<Values>({
    defaultValues: { scores: Object.fromEntries(spec.questions.map((q) => [q.code, ''])), steps: '' },
  });
  const errors = formState.errors;
  const answered = useWatch({ control, name: 'scores' });

  const onSubmit = handleSubmit((v) => {
    const body = toSubmit(v);
    if (Object.keys(body.scores).length === 0) {
      setError('root', { message: 'Please answer at least one of the questions before sending.' });
      return;
    }
    submit.mutate(body, { onSuccess: onDone });
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate className="space-y-8">
      {spec.questions.map((q) => {
        const words = QUESTION_WORDS[q.code] ?? { question: q.label, hint: `A number from ${q.min} to ${q.max}.` };
        if (q.input === 'rating') {
          return (
            <RatingScale
              key={q.code}
              name={q.code}
              legend={words.question}
              hint={words.hint}
              low={words.low}
              high={words.high}
              min={q.min}
              max={q.max}
              register={register(field(q))}
              checked={answered?.[q.code] || undefined}
              onClear={() => setValue(field(q), '')}
            />
          );
        }
        const err = errors.scores?.[q.code]?.message;
        return (
          <div key={q.code} className="space-y-2">
            <label htmlFor={`q-${q.code}`} className="block text-lg font-medium">
              {words.question}
            </label>
            <p id={`q-${q.code}-hint`} className="text-sm text-ink-soft">
              {words.hint}
            </p>
            <input
              id={`q-${q.code}`}
              inputMode="decimal"
              autoComplete="off"
              aria-invalid={Boolean(err)}
              aria-describedby={`q-${q.code}-hint${err ? ` q-${q.code}-error` : ''}`}
              className={inputClass}
              {...register(field(q), { validate: numberRule(q) })}
            />
            {err ? (
              <p id={`q-${q.code}-error`} className="text-bad">
                {err}
              </p>
            ) : null}
          </div>
        );
      })}

      <div className="space-y-2">
        <label htmlFor="q-steps" className="block text-lg font-medium">
          {STEPS_WORDS.question}
        </label>
        <p id="q-steps-hint" className="text-sm text-ink-soft">
          {STEPS_WORDS.hint}
        </p>
        <input
          id="q-steps"
          inputMode="numeric"
          autoComplete="off"
          aria-invalid={Boolean(errors.steps)}
          aria-describedby={`q-steps-hint${errors.steps ? ' q-steps-error' : ''}`}
          className={inputClass}
          {...register('steps', {
            validate: (raw) =>
              raw.trim() === '' ||
              (/^\d{1,6}$/.test(raw.trim()) && Number(raw) <= 100_000) ||
              'Enter a whole number of steps (up to 100000), or leave it empty',
          })}
        />
        {errors.steps ? (
          <p id="q-steps-error" className="text-bad">
            {errors.steps.message}
          </p>
        ) : null}
      </div>

      {errors.root ? (
        <p role="alert" className="text-lg text-bad">
          {errors.root.message}
        </p>
      ) : null}
      {submit.error ? <ErrorNotice error={submit.error} title="Your answers were not sent" /> : null}
      <button
        type="submit"
        disabled={submit.isPending}
        className="w-full rounded bg-accent-strong px-6 py-4 text-lg font-semibold text-white hover:bg-accent disabled:opacity-60 sm:w-auto"
      >
        {submit.isPending ? 'Sending…' : 'Send my answers'}
      </button>
    </form>
  );
}
