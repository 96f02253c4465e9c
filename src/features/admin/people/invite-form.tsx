import { useForm, useWatch } from 'react-hook-form';
import { InvitationInputSchema, type InvitationInput } from '../../../../shared/account';
import type { ClinicSummary } from '../../../../shared/schemas/admin';
import type { Role } from '../../../../shared/roles';
import { ErrorNotice } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { ROLE_LABELS } from '../../auth';
import { applyServerIssues } from '../../episodes/form-validation';
import { useInvitePerson } from '../api/invite-person';
import { primaryButton } from '../components/buttons';
import { SavedNote } from '../components/panel';

/** Who may invite whom (the invitation service decides; the form only offers what it will accept). */
const INVITES: Record<'steward' | 'lead', Role[]> = { steward: ['lead', 'researcher', 'steward'], lead: ['clinician'] };

type Values = { email: string; role: Role; clinicId: string };

/** An invitation by e-mail: the person sets their own name and password from the link. */
export function InviteForm({ as, clinics }: { as: 'steward' | 'lead'; clinics: ClinicSummary[] }) {
  const invite = useInvitePerson();
  const roles = INVITES[as];
  const form = useForm<Values>({ defaultValues: { email: '', role: roles[0]!, clinicId: '' } });
  const { register, handleSubmit, formState, setError, reset, control } = form;
  const role = useWatch({ control, name: 'role' });
  const needsClinic = as === 'steward' && (role === 'lead' || role === 'clinician');
  const onSubmit = handleSubmit(async (v) => {
    const input: InvitationInput = {
      email: v.email,
      role: v.role,
      clinicId: needsClinic && v.clinicId ? Number(v.clinicId) : null,
    };
    const parsed = InvitationInputSchema.safeParse(input);
    if (!parsed.success) {
      // The shared schema's own words, next to the field they concern.
      for (const i of parsed.error.issues)
        setError(i.path.join('.') as keyof Values, { type: 'schema', message: i.message });
      return;
    }
    try {
      await invite.mutateAsync(parsed.data);
      reset({ email: '', role: v.role, clinicId: v.clinicId });
    } catch (e) {
      applyServerIssues(e, setError);
    }
  });
  return (
    <form noValidate onSubmit={(e) => void onSubmit(e)} aria-label="Invite a person" className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-3">
        <FormField id="invite-email" label="E-mail address" required error={formState.errors.email?.message}>
          {(a11y) => <input {...a11y} {...register('email')} type="email" autoComplete="off" className={inputClass} />}
        </FormField>
        <FormField id="invite-role" label="Role" error={formState.errors.role?.message}>
          {(a11y) => (
            <select {...a11y} {...register('role')} className={inputClass}>
              {roles.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
          )}
        </FormField>
        {needsClinic ? (
          <FormField id="invite-clinic" label="Clinic" required error={formState.errors.clinicId?.message}>
            {(a11y) => (
              <select {...a11y} {...register('clinicId')} className={inputClass}>
                <option value="">Choose a clinic</option>
                {clinics
                  .filter((c) => c.active)
                  .map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.code} · {c.displayName}
                    </option>
                  ))}
              </select>
            )}
          </FormField>
        ) : null}
      </div>
      {as === 'steward' ? (
        <p className="text-xs text-ink-faint">Clinicians are invited by their clinic’s lead.</p>
      ) : null}
      {invite.error && !formState.errors.email ? (
        <ErrorNotice error={invite.error} title="The invitation was not sent" />
      ) : null}
      {invite.isSuccess && !formState.isDirty ? (
        <SavedNote>
          Invitation {invite.data.mailSent ? 'sent' : 'saved, but the e-mail could not be sent; resend it later'} to{' '}
          {invite.data.account.email}.
        </SavedNote>
      ) : null}
      <button type="submit" className={primaryButton} disabled={formState.isSubmitting}>
        Send invitation
      </button>
    </form>
  );
}
