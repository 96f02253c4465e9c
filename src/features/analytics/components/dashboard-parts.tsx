import type { ReactNode } from 'react';
import type { AnalyticsMeta } from '../../../../shared/schemas/analytics';
import { ErrorNotice } from '../../../components/error-notice';
import { dateTime } from '../format';

/** The heading block of a dashboard screen. */
export function DashboardHeader({ title, intro, meta }: { title: string; intro: ReactNode; meta?: AnalyticsMeta }) {
  return (
    <header className="space-y-2">
      <h1 className="text-2xl font-semibold tracking-tight text-ink">{title}</h1>
      <p className="max-w-3xl text-sm leading-relaxed text-ink-soft">{intro}</p>
      {meta ? <MetaLine meta={meta} /> : null}
    </header>
  );
}

/** Whose episodes, which rules version, how fresh: every screen says where its numbers come from. */
export function MetaLine({ meta }: { meta: AnalyticsMeta }) {
  return (
    <p className="text-xs text-ink-faint" data-testid="meta-line">
      {meta.subject.label}
      {meta.consentingOnly ? ' · consenting episodes only' : ''} · registry rules version {meta.rulesVersion} · computed{' '}
      {dateTime(meta.computedAt)}
    </p>
  );
}

/** Designed loading state for a whole dashboard: the outline of what is coming, not a blank page. */
export function DashboardLoading({ label }: { label: string }) {
  return (
    <div role="status" aria-live="polite" className="space-y-4">
      <span className="sr-only">{label}</span>
      <div className="grid grid-cols-2 gap-3 md:grid-cols-3 lg:grid-cols-5">
        {[0, 1, 2, 3, 4].map((k) => (
          <div key={k} className="h-24 animate-pulse rounded border border-line bg-surface" />
        ))}
      </div>
      <div className="flex h-72 animate-pulse items-center justify-center rounded border border-line bg-surface text-sm text-ink-faint">
        {label}
      </div>
    </div>
  );
}

/** A failed load; a 422 means the filters in the address are not valid, so offer to clear them. */
export function DashboardError({
  error,
  onRetry,
  onReset,
}: {
  error: unknown;
  onRetry: () => void;
  onReset: () => void;
}) {
  const status = (error as { status?: number })?.status;
  return (
    <div className="space-y-2">
      <ErrorNotice error={error} title="These numbers could not be loaded" onRetry={onRetry} />
      {status === 422 ? (
        <button type="button" className="text-sm text-accent underline" onClick={onReset}>
          Clear the filters
        </button>
      ) : null}
    </div>
  );
}

/** The standing caution of the exercise signals (and of any comparison of add-ons). */
export function AssociationCaution() {
  return (
    <aside
      className="rounded border border-caution/40 bg-caution/5 px-4 py-3 text-sm leading-relaxed text-ink"
      aria-label="How to read these signals"
    >
      <p className="font-medium text-caution">Associations, not effects</p>
      <p className="mt-1">
        These are observational associations from routine care. Who receives which exercise is not random: it depends on
        the patient, the clinician and the course so far, so the comparisons are confounded. The adjusted estimate
        accounts only for activity profile and symptom duration. Nothing here is evidence that an exercise works, or a
        reason to choose one for a patient.
      </p>
    </aside>
  );
}

type DashboardQuery<T> = {
  data: T | undefined;
  error: unknown;
  isPending: boolean;
  isError: boolean;
  isPlaceholderData: boolean;
  refetch: () => unknown;
};

/**
 * What every dashboard shows below its filters: the loading outline, a failure with a way out (retry, or
 * clear the filters when the address holds invalid ones), or the numbers, dimmed while newer ones load.
 * A failed refresh over numbers already shown keeps them and says so above them.
 */
export function DashboardBody<T>({
  query,
  loading,
  onReset,
  className = 'space-y-6',
  children,
}: {
  query: DashboardQuery<T>;
  loading: string;
  onReset: () => void;
  className?: string;
  children: (data: T) => ReactNode;
}) {
  if (query.isPending) return <DashboardLoading label={loading} />;
  const retry = () => void query.refetch();
  if (query.data === undefined)
    return query.isError ? <DashboardError error={query.error} onRetry={retry} onReset={onReset} /> : null;
  return (
    <div className={`${className} transition-opacity ${query.isPlaceholderData ? 'opacity-60' : ''}`}>
      {query.isError ? <DashboardError error={query.error} onRetry={retry} onReset={onReset} /> : null}
      {children(query.data)}
    </div>
  );
}
