import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { Loading } from '../components/loading';
import { useSelfReportForm } from '../features/self-report/api/get-self-report-form';
import { LinkProblem } from '../features/self-report/link-problem';
import { SafetyNote } from '../features/self-report/safety-note';
import { SelfReportForm } from '../features/self-report/self-report-form';

const WHEN: Record<string, string> = { week6: 'about 6 weeks', week12: 'about 12 weeks', week26: 'about 26 weeks' };

/**
 * The patient's page, opened from a single-use link without signing in: outside the app shell, with large
 * targets for a phone. It shows the clinic's name and the questions, nothing about the record.
 */
export function Component() {
  const token = useParams().token ?? '';
  const { data, error, isPending } = useSelfReportForm(token);
  const [done, setDone] = useState(false);

  return (
    <div className="min-h-screen bg-canvas text-ink">
      <main id="main" className="mx-auto max-w-2xl space-y-6 px-4 py-8 sm:px-6">
        <p className="text-sm font-semibold tracking-tight text-accent-strong">Loadline</p>
        {isPending ? (
          <Loading label="Opening your questions…" />
        ) : error ? (
          <LinkProblem error={error} />
        ) : done ? (
          <div role="status" className="space-y-3 rounded border border-good/40 bg-surface p-6">
            <h1 className="text-2xl font-semibold">Thank you, your answers were sent</h1>
            <p className="text-lg text-ink-soft">
              {data.clinicName} will see them at your next contact. You can close this page.
            </p>
            <SafetyNote />
          </div>
        ) : (
          <>
            <header className="space-y-2">
              <h1 className="text-2xl font-semibold">{data.clinicName}: how is your heel?</h1>
              <p className="text-lg text-ink-soft">
                Your clinic asks a few questions {WHEN[data.timepoint] ?? ''} after your care started. It takes about
                two minutes. You can skip any question.
              </p>
            </header>
            <SafetyNote />
            <SelfReportForm token={token} spec={data} onDone={() => setDone(true)} />
          </>
        )}
      </main>
    </div>
  );
}
