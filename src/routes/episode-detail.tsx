import type { ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { paths } from '../config/paths';
import { ApiError } from '../lib/api-client';
import { useEpisode } from '../features/episodes/api/get-episode';
import { DischargeForm } from '../features/episodes/detail/discharge-form';
import { EpisodeFacts } from '../features/episodes/detail/episode-facts';
import { FollowUpForm } from '../features/episodes/detail/follow-up-form';
import { InterventionsForm } from '../features/episodes/detail/interventions-form';
import { ScoreHistory } from '../features/episodes/detail/score-history';
import { STATUS_LABELS } from '../features/episodes/labels';
import { StatusBadge } from '../features/episodes/status-badge';
import { useInstruments } from '../features/reference/api/get-instruments';
import { useInterventions } from '../features/reference/api/get-interventions';
import { EpisodeTrajectoryChart } from '../features/analytics';

function Panel({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="space-y-4">
      <h2 id={id} className="text-lg font-medium">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** One episode: facts, scores over time with change since the start, and the forms that add to it. */
export function Component() {
  const id = Number(useParams().episodeId);
  const valid = Number.isInteger(id) && id > 0;
  const episode = useEpisode(id);
  const instruments = useInstruments();
  const codes = useInterventions();

  if (!valid || (episode.error instanceof ApiError && episode.error.status === 404)) {
    return (
      <EmptyState title="No such episode" action={<Link to={paths.episodes} className="text-accent hover:underline">Back to the caseload</Link>}>
        It may belong to another clinic, or the address is mistyped.
      </EmptyState>
    );
  }
  const error = episode.error ?? instruments.error ?? codes.error;
  if (error) return <ErrorNotice error={error} title="The episode could not be loaded" onRetry={() => void episode.refetch()} />;
  if (!episode.data || !instruments.data || !codes.data) return <Loading label="Loading the episode…" />;
  const e = episode.data;

  return (
    <article className="space-y-10">
      <header className="space-y-2">
        <Link to={paths.episodes} className="text-sm text-accent hover:underline">
          ← Caseload
        </Link>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-2xl font-semibold">Episode {e.reference}</h1>
          <StatusBadge status={e.status} label={STATUS_LABELS[e.status]} />
        </div>
      </header>
      <EpisodeFacts episode={e} />
      <Panel id="scores-heading" title="Scores over time">
        <ScoreHistory episode={e} instruments={instruments.data.items} />
      </Panel>
      <Panel id="course-heading" title="Course of care">
        <EpisodeTrajectoryChart episodeId={e.id} />
      </Panel>
      {e.status === 'open' ? (
        <Panel id="follow-up-heading" title="Add a follow-up">
          <FollowUpForm episode={e} instruments={instruments.data.items} />
        </Panel>
      ) : null}
      <Panel id="interventions-heading" title="What the episode receives">
        <InterventionsForm episode={e} codes={codes.data.items} />
      </Panel>
      <Panel id="discharge-heading" title={e.status === 'open' ? 'End the episode' : 'Episode ended'}>
        <DischargeForm key={e.version} episode={e} />
      </Panel>
    </article>
  );
}
