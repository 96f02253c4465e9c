import { useState, type FormEvent } from 'react';
import { inputClass } from '../../../components/form-field';
import { useAuditFacets } from '../api/get-audit-facets';
import { quietButton } from '../components/buttons';
import type { AuditState } from './audit-params';

/** Who, what and when; the person filter is applied on submit, the menus and dates at once. */
export function AuditFilters({ state, update }: { state: AuditState; update: (s: Partial<AuditState>) => void }) {
  const facets = useAuditFacets();
  const [actor, setActor] = useState(state.actor);
  const onSearch = (e: FormEvent) => {
    e.preventDefault();
    update({ actor: actor.trim(), page: 1 });
  };
  const select = (id: string, label: string, value: string, options: string[], key: 'action' | 'entity') => (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <select
        id={id}
        value={value}
        onChange={(e) => update({ [key]: e.target.value, page: 1 })}
        className={`${inputClass} w-48`}
      >
        <option value="">Any</option>
        {[...new Set([...options, ...(value ? [value] : [])])].map((o) => (
          <option key={o} value={o}>
            {o}
          </option>
        ))}
      </select>
    </div>
  );
  return (
    <div className="flex flex-wrap items-end gap-4">
      <form role="search" onSubmit={onSearch} className="flex items-end gap-2">
        <div>
          <label htmlFor="audit-actor" className="block text-sm font-medium">
            Person (name or e-mail)
          </label>
          <input
            id="audit-actor"
            type="search"
            value={actor}
            maxLength={120}
            onChange={(e) => setActor(e.target.value)}
            className={`${inputClass} w-56`}
          />
        </div>
        <button type="submit" className={quietButton}>
          Filter
        </button>
      </form>
      {select('audit-action', 'Action', state.action, facets.data?.actions ?? [], 'action')}
      {select('audit-entity', 'Record', state.entity, facets.data?.entities ?? [], 'entity')}
      <div>
        <label htmlFor="audit-from" className="block text-sm font-medium">
          From (UTC)
        </label>
        <input
          id="audit-from"
          type="date"
          value={state.from}
          onChange={(e) => update({ from: e.target.value, page: 1 })}
          className={inputClass}
        />
      </div>
      <div>
        <label htmlFor="audit-to" className="block text-sm font-medium">
          To (UTC, included)
        </label>
        <input
          id="audit-to"
          type="date"
          value={state.to}
          min={state.from || undefined}
          onChange={(e) => update({ to: e.target.value, page: 1 })}
          className={inputClass}
        />
      </div>
    </div>
  );
}
