import { ErrorNotice } from '../../components/error-notice';
import { usePreferences } from './api/get-preferences';
import { useUpdatePreferences } from './api/update-preferences';

/** The caller's own switch for the morning e-mail of due follow-ups. */
export function DigestToggle() {
  const { data } = usePreferences();
  const update = useUpdatePreferences();
  if (!data) return null;
  const on = !data.digestOptOut;
  return (
    <div className="space-y-1">
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          role="switch"
          checked={on}
          disabled={update.isPending}
          onChange={(e) => update.mutate({ digestOptOut: !e.target.checked })}
          className="h-4 w-4 accent-accent"
        />
        Morning e-mail of follow-ups to record
      </label>
      <p className="text-xs text-ink-faint">Counts and episode references only, never scores.</p>
      {update.error ? <ErrorNotice error={update.error} title="The setting was not saved" /> : null}
    </div>
  );
}
