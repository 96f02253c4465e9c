import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useSearchParams } from 'react-router-dom';
import { paths } from '../config/paths';
import { useResetPassword } from '../features/auth/api/reset-password';
import { AuthPanel, FormMessage, primaryButton } from '../features/auth/components/auth-panel';
import { MissingToken } from '../features/auth/components/missing-token';
import { NewPasswordFields } from '../features/auth/components/new-password-fields';
import { accountErrorText } from '../features/auth/error-words';
import { NewPasswordFormSchema, type NewPasswordForm } from '../features/auth/password-forms';
import { PASSWORD_MIN } from '../../shared/account';

/** Opens from the reset e-mail: choose a new password; every session of the account ends. */
export function Component() {
  const token = useSearchParams()[0].get('token');
  const reset = useResetPassword();
  const form = useForm<NewPasswordForm>({
    resolver: zodResolver(NewPasswordFormSchema),
    defaultValues: { password: '', confirm: '' },
  });
  const { errors } = form.formState;
  if (!token)
    return <MissingToken title="Choose a new password" askAgain="Ask for a new link from the sign-in screen." />;
  if (reset.isSuccess) {
    return (
      <AuthPanel title="Password changed">
        <FormMessage tone="good">
          Your new password is set. Every earlier sign-in of your account has ended.
        </FormMessage>
        <Link to={paths.signIn} className={`${primaryButton} mt-4 block text-center`}>
          Sign in
        </Link>
      </AuthPanel>
    );
  }
  const onSubmit = form.handleSubmit((v) => reset.mutate({ token, password: v.password }));
  return (
    <AuthPanel
      title="Choose a new password"
      lead={`Use at least ${PASSWORD_MIN} characters; a few unrelated words work well.`}
    >
      <form noValidate onSubmit={onSubmit} className="space-y-4" aria-label="Choose a new password">
        {reset.isError ? (
          <div className="space-y-2">
            <FormMessage tone="bad">{accountErrorText(reset.error)}</FormMessage>
            <Link to={paths.forgotPassword} className="text-sm text-accent hover:underline">
              Send me a fresh link
            </Link>
          </div>
        ) : null}
        <NewPasswordFields
          password={form.register('password')}
          confirm={form.register('confirm')}
          errors={errors}
          labels={{ password: 'New password', confirm: 'New password again' }}
        />
        <button type="submit" disabled={reset.isPending} className={primaryButton}>
          {reset.isPending ? 'Saving…' : 'Save the new password'}
        </button>
      </form>
    </AuthPanel>
  );
}
