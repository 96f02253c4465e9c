import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { PASSWORD_MIN } from '../../shared/account';
import { paths } from '../config/paths';
import { FormField, inputClass } from '../components/form-field';
import { useAcceptInvitation } from '../features/auth/api/accept-invitation';
import { AuthPanel, FormMessage, primaryButton } from '../features/auth/components/auth-panel';
import { MissingToken } from '../features/auth/components/missing-token';
import { NewPasswordFields } from '../features/auth/components/new-password-fields';
import { accountErrorText } from '../features/auth/error-words';
import { AcceptFormSchema, type AcceptForm } from '../features/auth/password-forms';

/** Opens from the invitation e-mail: the invitee sets name and password and is signed in. */
export function Component() {
  const token = useSearchParams()[0].get('token');
  const navigate = useNavigate();
  const accept = useAcceptInvitation();
  const form = useForm<AcceptForm>({
    resolver: zodResolver(AcceptFormSchema),
    defaultValues: { name: '', password: '', confirm: '' },
  });
  const { errors } = form.formState;
  if (!token)
    return (
      <MissingToken
        title="Set up your account"
        askAgain="Ask the person who invited you to send the invitation again."
      />
    );
  const onSubmit = form.handleSubmit((v) =>
    accept.mutate(
      { token, name: v.name, password: v.password },
      { onSuccess: () => void navigate(paths.home, { replace: true }) },
    ),
  );
  return (
    <AuthPanel
      title="Set up your account"
      lead="Choose the name others in the registry see and a password for signing in."
    >
      <form noValidate onSubmit={onSubmit} className="space-y-4" aria-label="Set up your account">
        {accept.isError ? <FormMessage tone="bad">{accountErrorText(accept.error)}</FormMessage> : null}
        <FormField id="name" label="Your name" error={errors.name?.message}>
          {(a11y) => (
            <input {...a11y} type="text" autoComplete="name" className={inputClass} {...form.register('name')} />
          )}
        </FormField>
        <NewPasswordFields
          password={form.register('password')}
          confirm={form.register('confirm')}
          errors={errors}
          labels={{ password: 'Password', confirm: 'Password again' }}
          hint={`At least ${PASSWORD_MIN} characters.`}
        />
        <button type="submit" disabled={accept.isPending} className={primaryButton}>
          {accept.isPending ? 'Setting up…' : 'Open my account'}
        </button>
      </form>
    </AuthPanel>
  );
}
