import { paths } from './paths';
import type { Role } from '../../shared/roles';

/**
 * `roles`: who may use the screen (absent: everyone); the shell hides the entry from other roles
 * and the route is guarded with RequireRole. `devOnly`: exists only outside production (the Outbox).
 */
export type NavItem = { to: string; label: string; roles?: readonly Role[]; devOnly?: boolean };

/** The main navigation; each screen adds its entry here. */
export const navigation: NavItem[] = [
  { to: paths.home, label: 'Overview' },
  { to: paths.episodes, label: 'Caseload', roles: ['lead', 'clinician'] },
  { to: paths.upload, label: 'Upload', roles: ['lead', 'clinician'] },
  { to: paths.followUps, label: 'Follow-ups', roles: ['lead', 'clinician'] },
  { to: paths.clinicResults, label: 'Clinic results', roles: ['lead', 'clinician', 'steward'] },
  { to: paths.recoveryCurves, label: 'Recovery curves', roles: ['lead', 'clinician', 'steward', 'researcher'] },
  { to: paths.exerciseSignals, label: 'Exercise signals', roles: ['lead', 'clinician', 'researcher'] },
  { to: paths.peerComparison, label: 'Peer comparison', roles: ['lead', 'steward', 'researcher'] },
  { to: paths.cohorts, label: 'Cohorts', roles: ['researcher', 'steward'] },
  { to: paths.dataRequests, label: 'Data requests', roles: ['researcher', 'steward'] },
  { to: paths.exportsLog, label: 'Exports log', roles: ['steward'] },
  { to: paths.consoleClinics, label: 'Registry console', roles: ['steward'] },
  { to: paths.consolePeople, label: 'Team', roles: ['lead'] },
  { to: paths.outbox, label: 'Outbox', roles: ['steward'], devOnly: true },
];
