import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { AuthPanel } from './auth-panel';

/** Shown when a link page is opened without its token. */
export function MissingToken({ title, askAgain }: { title: string; askAgain: string }) {
  return (
    <AuthPanel title={title} lead="This page opens from the link in your e-mail, and that link is missing here.">
      <p className="text-sm text-ink-soft">{askAgain}</p>
      <p className="mt-4 text-sm">
        <Link to={paths.signIn} className="text-accent hover:underline">
          Go to sign-in
        </Link>
      </p>
    </AuthPanel>
  );
}
