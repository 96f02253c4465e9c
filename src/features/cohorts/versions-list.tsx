import type { CohortDetail } from '../../../shared/schemas/cohort';
import { countShort, savedWhen } from './format';

/** Every saved version, newest first, with the count it had when it was saved. */
export function VersionsList({
  cohort,
  onShow,
}: {
  cohort: CohortDetail;
  onShow: (criteria: CohortDetail['criteria']) => void;
}) {
  return (
    <ol className="space-y-1 text-sm">
      {cohort.versions.map((v) => (
        <li
          key={v.version}
          className="flex flex-wrap items-baseline justify-between gap-2 border-b border-line py-1.5 last:border-0"
        >
          <span>
            <span className="font-medium">Version {v.version}</span>
            <span className="text-ink-faint">
              {' '}
              · {savedWhen(v.savedAt)} · {countShort(v.countAtSave)} episodes when saved
            </span>
          </span>
          <button type="button" className="text-accent hover:underline" onClick={() => onShow(v.criteria)}>
            Load these criteria
          </button>
        </li>
      ))}
    </ol>
  );
}
