import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { ForgotInputSchema, type ForgotInput } from '../../shared/account';
import { paths } from '../config/paths';
import { FormField, inputClass } from '../components/form-field';
import { useRequestPasswordReset } from '../features/auth/api/forgot-password';
import { AuthPanel, FormMessage, primaryButton } from '../features/auth/components/auth-panel';
import { accountErrorText } from '../features/auth/error-words';

/** Asks for a reset link; says the same whether or not the address has an account. */
export function Component() {
  const ask = useRequestPasswordReset();
  const form = useForm<ForgotInput>({ resolver: zodResolver(ForgotInputSchema), defaultValues: { email: '' } });
  const onSubmit = form.handleSubmit((v) => ask.mutate(v));
  return (
    <AuthPanel
      title="Choose a new password"
      lead="Enter the e-mail address of your account. We send a link that works once, for one hour."
    >
      {ask.isSuccess ? (
        <div className="space-y-4">
          <FormMessage tone="good">{ask.data.message}</FormMessage>
          <p className="text-sm text-ink-soft">
            Nothing arrived after a few minutes? Check the spam folder, or ask your clinic lead.
          </p>
        </div>
      ) : (
        <form noValidate onSubmit={onSubmit} className="space-y-4" aria-label="Ask for a reset link">
          {ask.isError ? <FormMessage tone="bad">{accountErrorText(ask.error)}</FormMessage> : null}
          <FormField id="email" label="E-mail" error={form.formState.errors.email?.message}>
            {(a11y) => (
              <input
                {...a11y}
                type="email"
                autoComplete="username"
                className={inputClass}
                {...form.register('email')}
              />
            )}
          </FormField>
          <button type="submit" disabled={ask.isPending} className={primaryButton}>
            {ask.isPending ? 'Sending…' : 'Send me a link'}
          </button>
        </form>
      )}
      <p className="mt-4 text-center text-sm">
        <Link to={paths.signIn} className="text-accent hover:underline">
          Back to sign-in
        </Link>
      </p>
    </AuthPanel>
  );
}
