import { useState, type FormEvent } from 'react';
import type { PseudonymSalt } from '../../../../shared/schemas/reference';
import { FormField, inputClass } from '../../../components/form-field';
import { forgetPseudonymKey, pseudonymOf, unlockPseudonyms, usePseudonymUnlocked } from '../pseudonym-key';

type Props = {
  salt: PseudonymSalt;
  pseudonym: string | undefined;
  onPseudonym: (hex: string | undefined) => void;
  /** The form's error for the pseudonym (e.g. "make the pseudonym first"). */
  error?: string | undefined;
};

const buttonClass =
  'rounded border border-accent px-3 py-2 text-sm text-accent-strong hover:bg-accent-tint disabled:opacity-50';

/**
 * Makes the patient's pseudonym in this browser: passphrase → key (PBKDF2, once per tab), then
 * local identifier → HMAC. These inputs are their own little forms, outside the episode form, so
 * neither value can end up in what is sent; only the 64-character result is handed to the parent.
 */
export function PseudonymPanel({ salt, pseudonym, onPseudonym, error }: Props) {
  const unlocked = usePseudonymUnlocked(salt.salt);
  const [passphrase, setPassphrase] = useState('');
  const [localId, setLocalId] = useState('');
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  const run = async (work: () => Promise<void>) => {
    setBusy(true);
    setProblem(null);
    try {
      await work();
    } catch (e) {
      setProblem(e instanceof Error ? e.message : 'The pseudonym could not be made');
    } finally {
      setBusy(false);
    }
  };
  const unlock = (e: FormEvent) => {
    e.preventDefault();
    void run(async () => {
      await unlockPseudonyms(passphrase, salt.salt);
      setPassphrase('');
    });
  };
  const derive = (e: FormEvent) => {
    e.preventDefault();
    void run(async () => onPseudonym(await pseudonymOf(localId, salt.salt)));
  };

  return (
    <section aria-labelledby="pseudonym-heading" className="space-y-4 rounded border border-line bg-surface p-5">
      <div>
        <h2 id="pseudonym-heading" className="text-lg font-medium">
          Patient pseudonym
        </h2>
        <p className="mt-1 text-sm text-ink-soft">
          The local patient identifier and the clinic passphrase never leave this browser. Loadline receives only a
          keyed hash of the identifier ({salt.algorithm}).
        </p>
      </div>
      {!unlocked ? (
        <form onSubmit={unlock} className="flex flex-wrap items-end gap-3" aria-label="Unlock pseudonyms">
          <FormField
            id="clinic-passphrase"
            label="Clinic passphrase"
            hint="Asked once while this tab stays open; kept only in this tab’s memory."
            className="w-80"
          >
            {(a11y) => (
              <input
                {...a11y}
                type="password"
                autoComplete="off"
                value={passphrase}
                onChange={(e) => setPassphrase(e.target.value)}
                className={inputClass}
              />
            )}
          </FormField>
          <button type="submit" className={buttonClass} disabled={busy || passphrase.length === 0}>
            {busy ? 'Preparing the key…' : 'Use passphrase'}
          </button>
        </form>
      ) : (
        <form onSubmit={derive} className="flex flex-wrap items-end gap-3" aria-label="Make the pseudonym">
          <FormField
            id="local-patient-id"
            label="Local patient identifier"
            hint="As in your clinic’s own records; stays in this browser."
            className="w-80"
          >
            {(a11y) => (
              <input
                {...a11y}
                type="text"
                autoComplete="off"
                spellCheck={false}
                value={localId}
                onChange={(e) => {
                  setLocalId(e.target.value);
                  onPseudonym(undefined);
                }}
                className={inputClass}
              />
            )}
          </FormField>
          <button type="submit" className={buttonClass} disabled={busy || localId.trim().length === 0}>
            Make pseudonym
          </button>
          <button
            type="button"
            className="py-2 text-sm text-ink-soft underline"
            onClick={() => {
              forgetPseudonymKey();
              onPseudonym(undefined);
            }}
          >
            Forget passphrase
          </button>
        </form>
      )}
      <p role="status" className="text-sm">
        {pseudonym ? (
          <>
            Pseudonym ready: <span className="tabular font-mono font-medium">{pseudonym.slice(0, 8)}</span>
            <span className="text-ink-faint">… (first 8 of 64 characters)</span>
          </>
        ) : (
          <span className="text-ink-faint">No pseudonym yet.</span>
        )}
      </p>
      {(problem ?? error) ? <p className="text-sm text-bad">{problem ?? error}</p> : null}
    </section>
  );
}
