import { useEffect, useRef } from 'react';
import { NavLink, Outlet, useLocation, useNavigate } from 'react-router-dom';
import { navigation } from '../config/navigation';
import { paths } from '../config/paths';
import { signInPathFor, UserMenu, useSession, visibleNavigation, type NoticeState } from '../features/auth';
import { onUnauthorized } from '../lib/session-events';
import { ClinicalCaution } from './clinical-caution';
import { ConnectionStatus } from './connection-status';

/** Pages that work signed out; a 401 there does not send anyone to sign-in. */
const PUBLIC = [paths.signIn, paths.forgotPassword, paths.resetPassword, paths.acceptInvitation];

/** After any 401, go to sign-in and come back here afterwards. */
function useSignInOnUnauthorized() {
  const navigate = useNavigate();
  const location = useLocation();
  const here = useRef(location);
  useEffect(() => {
    here.current = location;
  }, [location]);
  useEffect(
    () =>
      onUnauthorized(() => {
        const { pathname, search } = here.current;
        if (PUBLIC.some((p) => pathname.startsWith(p))) return;
        void navigate(signInPathFor(pathname + search), {
          replace: true,
          state: { notice: 'Your session has ended. Sign in again to continue.' } satisfies NoticeState,
        });
      }),
    [navigate],
  );
}

/** The frame of every screen: product name, navigation, the signed-in person, content, the standing caution. */
export function AppShell() {
  const session = useSession();
  const location = useLocation();
  const notice = (location.state as NoticeState | null)?.notice;
  useSignInOnUnauthorized();
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-surface focus:p-2"
      >
        Skip to content
      </a>
      <header className="border-b border-line bg-surface">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-8 gap-y-2 px-6 py-3">
          <NavLink to={paths.home} className="text-lg font-semibold tracking-tight text-accent-strong">
            Loadline
          </NavLink>
          <nav aria-label="Main" className="order-last flex w-full flex-wrap gap-1 lg:order-none lg:w-auto lg:flex-1">
            {visibleNavigation(navigation, session).map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                end
                className={({ isActive }) =>
                  `rounded px-3 py-1.5 text-sm ${isActive ? 'bg-accent-tint text-accent-strong' : 'text-ink-soft hover:text-ink'}`
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          <ConnectionStatus />
          <UserMenu />
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-6 py-8">
        {notice ? (
          <p role="status" className="mb-6 rounded border border-caution/40 bg-caution/5 px-4 py-2 text-sm text-ink">
            {notice}
          </p>
        ) : null}
        <Outlet />
      </main>
      <footer className="border-t border-line bg-surface">
        <ClinicalCaution className="mx-auto max-w-7xl px-6 py-4" />
      </footer>
    </div>
  );
}
