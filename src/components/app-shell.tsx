import { NavLink, Outlet } from 'react-router-dom';
import { navigation } from '../config/navigation';
import { paths } from '../config/paths';
import { ClinicalCaution } from './clinical-caution';
import { ConnectionStatus } from './connection-status';

/** The frame of every screen: product name, navigation, content, the standing caution. */
export function AppShell() {
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-surface focus:p-2">
        Skip to content
      </a>
      <header className="border-b border-line bg-surface">
        <div className="mx-auto flex max-w-7xl items-center gap-8 px-6 py-3">
          <NavLink to={paths.home} className="text-lg font-semibold tracking-tight text-accent-strong">
            Loadline
          </NavLink>
          <nav aria-label="Main" className="flex flex-1 gap-1">
            {navigation.map((item) => (
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
          <NavLink to={paths.signIn} className="text-sm text-accent hover:underline">
            Sign in
          </NavLink>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-6 py-8">
        <Outlet />
      </main>
      <footer className="border-t border-line bg-surface">
        <ClinicalCaution className="mx-auto max-w-7xl px-6 py-4" />
      </footer>
    </div>
  );
}
