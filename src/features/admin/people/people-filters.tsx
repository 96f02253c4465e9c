import { useState, type FormEvent } from 'react';
import type { ClinicSummary } from '../../../../shared/schemas/admin';
import { ROLES } from '../../../../shared/roles';
import { PERSON_STATUSES } from '../../../../shared/schemas/admin';
import { inputClass } from '../../../components/form-field';
import { ROLE_LABELS } from '../../auth';
import { quietButton } from '../components/buttons';
import { STATUS_WORDS, type PeopleState } from './people-params';

/** The people list's filters; each change goes to the address bar, so the view can be shared. */
export function PeopleFilters({
  state,
  update,
  clinics,
  steward,
}: {
  state: PeopleState;
  update: (s: Partial<PeopleState>) => void;
  clinics: ClinicSummary[];
  steward: boolean;
}) {
  const [q, setQ] = useState(state.q);
  const onSearch = (e: FormEvent) => {
    e.preventDefault();
    update({ q: q.trim(), page: 1 });
  };
  return (
    <div className="flex flex-wrap items-end gap-4">
      <form role="search" onSubmit={onSearch} className="flex items-end gap-2">
        <div>
          <label htmlFor="people-q" className="block text-sm font-medium">
            Name or e-mail
          </label>
          <input
            id="people-q"
            type="search"
            value={q}
            maxLength={80}
            onChange={(e) => setQ(e.target.value)}
            className={`${inputClass} w-56`}
          />
        </div>
        <button type="submit" className={quietButton}>
          Search
        </button>
      </form>
      {steward ? (
        <>
          <div>
            <label htmlFor="people-clinic" className="block text-sm font-medium">
              Clinic
            </label>
            <select
              id="people-clinic"
              value={state.clinicId ?? ''}
              onChange={(e) => update({ clinicId: e.target.value ? Number(e.target.value) : undefined, page: 1 })}
              className={`${inputClass} w-56`}
            >
              <option value="">Every clinic</option>
              {clinics.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.code} · {c.displayName}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor="people-role" className="block text-sm font-medium">
              Role
            </label>
            <select
              id="people-role"
              value={state.role ?? ''}
              onChange={(e) => update({ role: (e.target.value || undefined) as PeopleState['role'], page: 1 })}
              className={`${inputClass} w-44`}
            >
              <option value="">Any role</option>
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
          </div>
        </>
      ) : null}
      <div>
        <label htmlFor="people-status" className="block text-sm font-medium">
          Status
        </label>
        <select
          id="people-status"
          value={state.status ?? ''}
          onChange={(e) => update({ status: (e.target.value || undefined) as PeopleState['status'], page: 1 })}
          className={`${inputClass} w-52`}
        >
          <option value="">Any status</option>
          {PERSON_STATUSES.map((s) => (
            <option key={s} value={s}>
              {STATUS_WORDS[s]}
            </option>
          ))}
        </select>
      </div>
    </div>
  );
}
