import { Link, useNavigate } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { useSession } from '../api/get-me';
import { useSignOut } from '../api/sign-out';
import { ROLE_LABELS } from '../role-labels';

/** The signed-in person's name and role with a sign-out button; a sign-in link otherwise. */
export function UserMenu() {
  const { user, isPending } = useSession();
  const signOut = useSignOut();
  const navigate = useNavigate();
  if (isPending) return null;
  if (!user) {
    return (
      <Link to={paths.signIn} className="text-sm text-accent hover:underline">
        Sign in
      </Link>
    );
  }
  return (
    <div className="flex items-center gap-3 text-sm">
      <span className="text-right leading-tight">
        <span className="block font-medium text-ink">{user.name || user.email}</span>
        <span className="block text-xs text-ink-faint">{ROLE_LABELS[user.role]}</span>
      </span>
      <button
        type="button"
        disabled={signOut.isPending}
        onClick={() => signOut.mutate(undefined, { onSettled: () => void navigate(paths.signIn, { replace: true }) })}
        className="rounded border border-line px-3 py-1.5 text-ink-soft hover:border-accent hover:text-accent-strong disabled:opacity-60"
      >
        {signOut.isPending ? 'Signing out…' : 'Sign out'}
      </button>
    </div>
  );
}
