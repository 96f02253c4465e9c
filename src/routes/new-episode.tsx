import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { NewEpisodeForm } from '../features/episodes/new-episode/new-episode-form';
import { useInstruments } from '../features/reference/api/get-instruments';
import { usePseudonymSalt } from '../features/reference/api/get-pseudonym-salt';

/** New episode with its start-of-care scores. */
export function Component() {
  const instruments = useInstruments();
  const salt = usePseudonymSalt();
  return (
    <section className="max-w-5xl space-y-6">
      <header>
        <h1 className="text-2xl font-semibold">New episode</h1>
        <p className="text-sm text-ink-soft">
          Record a new episode of heel-pain care and the scores at its start. The registry never receives a name or a
          local patient number.
        </p>
      </header>
      {instruments.error || salt.error ? (
        <ErrorNotice error={instruments.error ?? salt.error} title="The form could not be prepared" />
      ) : instruments.data && salt.data ? (
        <NewEpisodeForm instruments={instruments.data.items} salt={salt.data} />
      ) : (
        <Loading label="Preparing the form…" />
      )}
    </section>
  );
}
