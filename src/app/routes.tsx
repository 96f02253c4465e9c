import type { RouteObject } from 'react-router-dom';
import { paths } from '../config/paths';
import { AppShell } from '../components/app-shell';
import { RouteError } from '../routes/route-error';
import { Loading } from '../components/loading';
import { guarded } from '../features/auth';

/** The route table: one lazily loaded module per screen under src/routes/. */
export const routes: RouteObject[] = [
  {
    path: paths.home,
    element: <AppShell />,
    errorElement: <RouteError />,
    hydrateFallbackElement: <Loading />,
    children: [
      { index: true, lazy: () => import('../routes/home') },
      { path: paths.signIn, lazy: () => import('../routes/sign-in') },
      { path: paths.forgotPassword, lazy: () => import('../routes/forgot-password') },
      { path: paths.resetPassword, lazy: () => import('../routes/reset-password') },
      { path: paths.acceptInvitation, lazy: () => import('../routes/accept-invitation') },
      guarded(['steward'], [{ path: paths.outbox, lazy: () => import('../routes/outbox') }]),
      guarded(['steward'], [
        { path: paths.consoleClinics, lazy: () => import('../routes/admin-clinics') },
        { path: paths.consoleInstruments, lazy: () => import('../routes/admin-instruments') },
        { path: paths.consoleRules, lazy: () => import('../routes/admin-rules') },
      ]),
      guarded(['steward', 'lead'], [
        { path: paths.consolePeople, lazy: () => import('../routes/admin-people') },
        { path: paths.consoleCodes, lazy: () => import('../routes/admin-codes') },
        { path: paths.consoleAudit, lazy: () => import('../routes/admin-audit') },
      ]),
      guarded(['lead', 'clinician'], [{ path: paths.followUps, lazy: () => import('../routes/follow-ups') }]),
      guarded(['lead', 'clinician'], [
        { path: paths.episodes, lazy: () => import('../routes/episodes') },
        { path: paths.newEpisode, lazy: () => import('../routes/new-episode') },
        { path: paths.episode, lazy: () => import('../routes/episode-detail') },
        { path: paths.episodeFollowUp, lazy: () => import('../routes/episode-follow-up') },
        { path: paths.upload, lazy: () => import('../routes/upload') },
      ]),
      guarded(['lead', 'clinician', 'steward'], [{ path: paths.clinicResults, lazy: () => import('../routes/clinic-results') }]),
      guarded(['lead', 'clinician', 'steward', 'researcher'], [{ path: paths.recoveryCurves, lazy: () => import('../routes/recovery-curves') }]),
      guarded(['lead', 'clinician', 'researcher'], [{ path: paths.exerciseSignals, lazy: () => import('../routes/exercise-signals') }]),
      guarded(['lead', 'steward', 'researcher'], [{ path: paths.peerComparison, lazy: () => import('../routes/peer-comparison') }]),
      guarded(['researcher', 'steward'], [
        { path: paths.cohorts, lazy: () => import('../routes/cohorts') },
        { path: paths.newCohort, lazy: () => import('../routes/cohort-builder') },
        { path: paths.cohort, lazy: () => import('../routes/cohort-builder') },
        { path: paths.dataRequests, lazy: () => import('../routes/data-requests') },
      ]),
      guarded(['steward'], [{ path: paths.exportsLog, lazy: () => import('../routes/exports-log') }]),
      { path: '*', lazy: () => import('../routes/not-found') },
    ],
  },
  // The patient's self-report page: outside the shell (no navigation, no sign-in).
  {
    path: paths.selfReport,
    errorElement: <RouteError />,
    hydrateFallbackElement: <Loading />,
    lazy: () => import('../routes/self-report'),
  },
];
