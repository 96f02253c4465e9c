import { useState } from 'react';
import { Link } from 'react-router-dom';
import { EmptyState } from '../../components/empty-state';
import { ErrorNotice } from '../../components/error-notice';
import { Loading } from '../../components/loading';
import { episodePath } from '../../config/paths';
import { formatDate } from '../episodes/format';
import { useLostProposals } from './api/list-lost-proposals';
import { useMarkLost } from './api/mark-lost';

const weeks = (days: number) => Math.floor(days / 7);
/** The longest-quiet first; the rest on request, so the screen stays readable. */
const FIRST = 10;

/**
 * Open episodes without any assessment for 26 weeks, proposed for "lost to follow-up". Nothing changes until the
 * lead confirms one; the change goes through the episode's own versioned update.
 */
export function LostProposals() {
  const { data, error, isPending, refetch } = useLostProposals(true);
  const mark = useMarkLost();
  const [all, setAll] = useState(false);
  return (
    <section aria-labelledby="lost-title" className="space-y-3 rounded border border-line bg-surface p-5">
      <h2 id="lost-title" className="text-lg font-semibold">
        No news for 26 weeks
      </h2>
      <p className="text-sm text-ink-soft">
        These open episodes have had no assessment for at least 26 weeks. Mark one as lost to follow-up only when the
        patient can no longer be reached; it stays open until you do.
      </p>
      {mark.error ? <ErrorNotice error={mark.error} title="The episode was not changed" /> : null}
      {error ? (
        <ErrorNotice error={error} title="The proposals could not be loaded" onRetry={() => void refetch()} />
      ) : isPending ? (
        <Loading label="Looking for quiet episodes…" />
      ) : data.items.length === 0 ? (
        <EmptyState title="No episode has gone quiet for 26 weeks." />
      ) : (
        <ul className="divide-y divide-line">
          {(all ? data.items : data.items.slice(0, FIRST)).map((p) => (
            <li key={p.episodeId} className="flex flex-wrap items-center justify-between gap-3 py-2.5 text-sm">
              <span>
                <Link to={episodePath(p.episodeId)} className="font-medium text-accent hover:underline">
                  {p.reference}
                </Link>
                <span className="text-ink-soft">
                  {' '}
                  · started {formatDate(p.startDate)} · last assessment {formatDate(p.lastAssessedOn)} (
                  {weeks(p.daysWithoutAssessment)} weeks ago)
                </span>
              </span>
              <button
                type="button"
                disabled={mark.isPending}
                onClick={() => mark.mutate({ episodeId: p.episodeId, version: p.version })}
                aria-label={`Mark as lost to follow-up: ${p.reference}`}
                className="rounded border border-caution/50 px-3 py-1.5 text-xs text-caution hover:bg-caution/10 disabled:opacity-60"
              >
                Mark as lost
              </button>
            </li>
          ))}
          {data.items.length > FIRST ? (
            <li className="pt-2.5">
              <button type="button" onClick={() => setAll((v) => !v)} className="text-sm text-accent underline">
                {all ? `Show the first ${FIRST} only` : `Show all ${data.items.length}`}
              </button>
            </li>
          ) : null}
        </ul>
      )}
    </section>
  );
}
