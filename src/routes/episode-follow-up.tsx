import { Link, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { TIMEPOINTS } from '../../shared/constants';
import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { episodePath, paths } from '../config/paths';
import { useEpisode } from '../features/episodes/api/get-episode';
import { FollowUpForm } from '../features/episodes/detail/follow-up-form';
import { formatDate } from '../features/episodes/format';
import { useInstruments } from '../features/reference/api/get-instruments';

type FollowUp = Exclude<(typeof TIMEPOINTS)[number], 'baseline'>;
const isFollowUp = (t: string | null): t is FollowUp => t !== null && t !== 'baseline' && (TIMEPOINTS as readonly string[]).includes(t);

/** Record one follow-up of an episode (linked from the follow-ups list); back to the episode after saving. */
export function Component() {
  const id = Number(useParams().episodeId);
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const episode = useEpisode(id);
  const instruments = useInstruments();
  const asked = params.get('timepoint');

  if (!(Number.isInteger(id) && id > 0)) return <EmptyState title="No such episode" />;
  const error = episode.error ?? instruments.error;
  if (error) return <ErrorNotice error={error} title="The episode could not be loaded" />;
  if (!episode.data || !instruments.data) return <Loading label="Loading the episode…" />;
  const e = episode.data;

  return (
    <section className="max-w-5xl space-y-6">
      <header className="space-y-1">
        <Link to={episodePath(e.id)} className="text-sm text-accent hover:underline">
          ← Episode {e.reference}
        </Link>
        <h1 className="text-2xl font-semibold">Add a follow-up to {e.reference}</h1>
        <p className="text-sm text-ink-soft">Started {formatDate(e.startDate)}. After saving, the episode shows the change since the start.</p>
      </header>
      {e.status === 'open' ? (
        <FollowUpForm
          episode={e}
          instruments={instruments.data.items}
          timepoint={isFollowUp(asked) ? asked : undefined}
          onSaved={(saved) => void navigate(episodePath(saved.id))}
        />
      ) : (
        <EmptyState title="This episode has ended" action={<Link to={paths.episodes} className="text-accent hover:underline">Back to the caseload</Link>}>
          Reopen it on the episode’s page to add a follow-up.
        </EmptyState>
      )}
    </section>
  );
}
