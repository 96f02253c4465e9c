import { useState, type FormEvent } from 'react';
import { EPISODE_STATUSES } from '../../../shared/constants';
import { inputClass } from '../../components/form-field';
import { STATUS_LABELS } from './labels';
import type { ListState } from './list-params';

type Props = { state: ListState; onChange: (next: Partial<ListState>) => void };

function SearchBox({ initial, onSearch }: { initial: string; onSearch: (q: string) => void }) {
  const [text, setText] = useState(initial);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    onSearch(text.trim());
  };
  return (
    <form role="search" onSubmit={submit} className="flex items-end gap-2">
      <div>
        <label htmlFor="episode-search" className="block text-sm font-medium">
          Find by episode reference
        </label>
        <input
          id="episode-search"
          type="search"
          value={text}
          maxLength={40}
          onChange={(e) => setText(e.target.value)}
          className={`${inputClass} w-64`}
        />
      </div>
      <button type="submit" className="rounded border border-line bg-surface px-3 py-2 text-sm hover:border-accent">
        Search
      </button>
    </form>
  );
}

/** Search by reference and filter by status; each change starts again at page 1. */
export function EpisodeFilters({ state, onChange }: Props) {
  return (
    <div className="flex flex-wrap items-end gap-4">
      {/* Keyed by the address's search, so going back in history shows that search in the box. */}
      <SearchBox key={state.q} initial={state.q} onSearch={(q) => onChange({ q, page: 1 })} />
      <div>
        <label htmlFor="episode-status" className="block text-sm font-medium">
          Status
        </label>
        <select
          id="episode-status"
          value={state.status ?? ''}
          onChange={(e) => onChange({ status: (e.target.value || undefined) as ListState['status'], page: 1 })}
          className={`${inputClass} w-48`}
        >
          <option value="">Any status</option>
          {EPISODE_STATUSES.map((s) => (
            <option key={s} value={s}>
              {STATUS_LABELS[s]}
            </option>
          ))}
        </select>
      </div>
    </div>
  );
}
