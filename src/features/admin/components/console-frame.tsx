import type { ReactNode } from 'react';
import { NavLink } from 'react-router-dom';
import type { Role } from '../../../../shared/roles';
import { paths } from '../../../config/paths';
import { useSession } from '../../auth';

type Tab = { to: string; label: string; roles: readonly Role[]; leadLabel?: string };

/** The console's own sections; a clinic lead sees the three that concern their clinic. */
const TABS: Tab[] = [
  { to: paths.consoleClinics, label: 'Clinics', roles: ['steward'] },
  { to: paths.consolePeople, label: 'People', roles: ['steward', 'lead'], leadLabel: 'Team' },
  { to: paths.consoleInstruments, label: 'Instruments', roles: ['steward'] },
  { to: paths.consoleCodes, label: 'Codes', roles: ['steward', 'lead'], leadLabel: 'Code proposals' },
  { to: paths.consoleRules, label: 'Rules', roles: ['steward'] },
  { to: paths.consoleAudit, label: 'Audit trail', roles: ['steward', 'lead'] },
];

/** The frame of each console screen: the section tabs, the title and a one-line purpose. */
export function ConsoleFrame({
  title,
  intro,
  actions,
  children,
}: {
  title: string;
  intro: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
}) {
  const { user } = useSession();
  const role = user?.role;
  const tabs = TABS.filter((t) => role && t.roles.includes(role));
  return (
    <section className="space-y-6">
      <div className="space-y-4 border-b border-line pb-4">
        <p className="text-xs font-medium uppercase tracking-wider text-ink-faint">
          {role === 'lead' ? 'Your clinic' : 'Registry console'}
        </p>
        <nav aria-label="Console sections" className="flex flex-wrap gap-1">
          {tabs.map((t) => (
            <NavLink
              key={t.to}
              to={t.to}
              className={({ isActive }) =>
                `rounded-full border px-3 py-1 text-sm ${isActive ? 'border-accent bg-accent-tint text-accent-strong' : 'border-line text-ink-soft hover:border-accent hover:text-ink'}`
              }
            >
              {role === 'lead' && t.leadLabel ? t.leadLabel : t.label}
            </NavLink>
          ))}
        </nav>
      </div>
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div className="max-w-3xl space-y-1">
          <h1 className="text-2xl font-semibold">{title}</h1>
          <p className="text-sm text-ink-soft">{intro}</p>
        </div>
        {actions}
      </header>
      {children}
    </section>
  );
}
