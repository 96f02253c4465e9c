/** Every client URL, in one place. */
export const paths = {
  home: '/',
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  // the same strings as ACCOUNT_LINK_PATHS in shared/account.ts (the e-mailed links)
  resetPassword: '/reset-password',
  acceptInvitation: '/accept-invitation',
  outbox: '/outbox',
  episodes: '/episodes',
  newEpisode: '/episodes/new',
  episode: '/episodes/:episodeId',
  upload: '/uploads',
  followUps: '/follow-ups',
  // The episodes client's form for recording one follow-up; the follow-ups screen links here.
  episodeFollowUp: '/episodes/:episodeId/follow-up',
  // The patient's page: outside the app shell, no sign-in (the token is the capability).
  selfReport: '/report/:token',
  // The registry console (steward; a clinic lead sees People, Audit trail and Code proposals).
  consoleClinics: '/console/clinics',
  consolePeople: '/console/people',
  consoleInstruments: '/console/instruments',
  consoleCodes: '/console/codes',
  consoleRules: '/console/rules',
  consoleAudit: '/console/audit',
  // Outcome dashboards.
  clinicResults: '/results',
  recoveryCurves: '/recovery',
  exerciseSignals: '/exercise-signals',
  peerComparison: '/peers',
  // Research: cohorts, data requests and the steward's exports log.
  cohorts: '/cohorts',
  newCohort: '/cohorts/new',
  cohort: '/cohorts/:cohortId',
  dataRequests: '/data-requests',
  exportsLog: '/exports',
} as const;

/** The address of one episode's screen. */
export const episodePath = (id: number) => `/episodes/${id}`;

/** The form recording one episode's follow-up at a timepoint (e.g. week12). */
export const episodeFollowUpPath = (id: number, timepoint: string) =>
  `/episodes/${id}/follow-up?timepoint=${encodeURIComponent(timepoint)}`;

/** The builder opened on one saved cohort. */
export const cohortPath = (id: number) => `/cohorts/${id}`;
