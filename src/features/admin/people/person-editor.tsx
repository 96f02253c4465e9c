import { useState } from 'react';
import type { ClinicSummary, Person } from '../../../../shared/schemas/admin';
import { CLINIC_ROLES, ROLES, type Role } from '../../../../shared/roles';
import { ErrorNotice } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { ROLE_LABELS } from '../../auth';
import { useUpdatePerson } from '../api/update-person';
import { primaryButton, quietButton } from '../components/buttons';

/** The steward's change of one person's role and/or clinic; the server re-checks every rule. */
export function PersonEditor({
  person,
  clinics,
  onDone,
}: {
  person: Person;
  clinics: ClinicSummary[];
  onDone: () => void;
}) {
  const update = useUpdatePerson();
  const [role, setRole] = useState<Role>(person.role);
  const [clinicId, setClinicId] = useState<string>(person.clinicId ? String(person.clinicId) : '');
  const needsClinic = CLINIC_ROLES.includes(role);
  const save = async () => {
    try {
      await update.mutateAsync({
        id: person.id,
        patch: { role, clinicId: needsClinic && clinicId ? Number(clinicId) : null },
      });
      onDone();
    } catch {
      // shown below
    }
  };
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-soft">
        {person.name || person.email}: {ROLE_LABELS[person.role]}
        {person.clinicCode ? ` at ${person.clinicCode}` : ''}. A change takes effect on their next request.
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        <FormField id="person-role" label="Role">
          {(a11y) => (
            <select {...a11y} value={role} onChange={(e) => setRole(e.target.value as Role)} className={inputClass}>
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
          )}
        </FormField>
        {needsClinic ? (
          <FormField id="person-clinic" label="Clinic">
            {(a11y) => (
              <select {...a11y} value={clinicId} onChange={(e) => setClinicId(e.target.value)} className={inputClass}>
                <option value="">Choose a clinic</option>
                {clinics
                  .filter((c) => c.active || c.id === person.clinicId)
                  .map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.code} · {c.displayName}
                    </option>
                  ))}
              </select>
            )}
          </FormField>
        ) : (
          <p className="self-end text-sm text-ink-faint">Stewards and researchers belong to no clinic.</p>
        )}
      </div>
      {update.error ? <ErrorNotice error={update.error} title="The change was not saved" /> : null}
      <div className="flex gap-2">
        <button type="button" className={primaryButton} disabled={update.isPending} onClick={() => void save()}>
          Save change
        </button>
        <button type="button" className={quietButton} onClick={onDone}>
          Cancel
        </button>
      </div>
    </div>
  );
}
