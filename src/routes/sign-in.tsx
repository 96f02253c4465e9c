import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { LoginInputSchema, type LoginInput } from '../../shared/auth';
import { paths } from '../config/paths';
import { FormField, inputClass } from '../components/form-field';
import { Loading } from '../components/loading';
import { safeNext, useSession, useSignIn } from '../features/auth';
import { AuthPanel, FormMessage, primaryButton } from '../features/auth/components/auth-panel';
import { accountErrorText } from '../features/auth/error-words';

/** Sign-in: e-mail and password; afterwards back to where the person was sent from. */
export function Component() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const navigate = useNavigate();
  const session = useSession();
  const signIn = useSignIn();
  const form = useForm<LoginInput>({
    resolver: zodResolver(LoginInputSchema),
    defaultValues: { email: '', password: '' },
  });
  const { errors } = form.formState;

  if (session.isPending) return <Loading label="Checking your sign-in…" />;
  if (session.user && !signIn.isPending) return <Navigate to={next} replace />;

  const onSubmit = form.handleSubmit((values) =>
    signIn.mutate(values, { onSuccess: () => void navigate(next, { replace: true }) }),
  );

  return (
    <AuthPanel title="Sign in" lead="Accounts are opened by invitation from your clinic lead or the registry steward.">
      <form noValidate onSubmit={onSubmit} className="space-y-4" aria-label="Sign in">
        {signIn.isError ? <FormMessage tone="bad">{accountErrorText(signIn.error)}</FormMessage> : null}
        <FormField id="email" label="E-mail" error={errors.email?.message}>
          {(a11y) => (
            <input {...a11y} type="email" autoComplete="username" className={inputClass} {...form.register('email')} />
          )}
        </FormField>
        <FormField id="password" label="Password" error={errors.password?.message}>
          {(a11y) => (
            <input
              {...a11y}
              type="password"
              autoComplete="current-password"
              className={inputClass}
              {...form.register('password')}
            />
          )}
        </FormField>
        <button type="submit" disabled={signIn.isPending} className={primaryButton}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </button>
        <p className="text-center text-sm">
          <Link to={paths.forgotPassword} className="text-accent hover:underline">
            Forgot password?
          </Link>
        </p>
      </form>
    </AuthPanel>
  );
}
