import type { Person } from '../../../../shared/schemas/admin';
import { errorText } from '../../../components/error-notice';
import { useDeactivatePerson } from '../api/deactivate-person';
import { useResendInvitation } from '../api/resend-invitation';
import { linkButton } from '../components/buttons';
import { ConfirmButton } from '../components/confirm-button';

/** The actions of one row: change (steward), resend an open invitation, deactivate. */
export function PersonActions({
  person,
  canChange,
  isSelf,
  onChange,
}: {
  person: Person;
  canChange: boolean;
  isSelf: boolean;
  onChange: () => void;
}) {
  const resend = useResendInvitation();
  const deactivate = useDeactivatePerson();
  if (person.status === 'deactivated') return <span className="text-xs text-ink-faint">No actions</span>;
  const who = person.name || person.email;
  return (
    <div className="flex flex-col items-start gap-1.5">
      {canChange && !isSelf ? (
        <button type="button" className={linkButton} onClick={onChange}>
          Change role or clinic
        </button>
      ) : null}
      {person.status === 'invited' ? (
        <button
          type="button"
          className={linkButton}
          disabled={resend.isPending}
          onClick={() => resend.mutate(person.id)}
        >
          {resend.isSuccess ? 'Invitation sent again' : 'Resend invitation'}
        </button>
      ) : null}
      {!isSelf ? (
        <ConfirmButton
          label="Deactivate"
          confirmLabel={`Deactivate ${who}`}
          busy={deactivate.isPending}
          consequence={`${who} can no longer sign in and is signed out everywhere. What they recorded stays in the registry.`}
          onConfirm={() => deactivate.mutate(person.id)}
        />
      ) : null}
      {resend.error || deactivate.error ? (
        <p role="alert" className="text-xs text-bad">
          {errorText(resend.error ?? deactivate.error)}
        </p>
      ) : null}
    </div>
  );
}
