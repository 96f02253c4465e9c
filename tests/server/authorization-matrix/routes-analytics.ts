import { roles, type Entry } from './types';

const ENDPOINTS = [
  { path: 'outcomes', who: ['lead', 'clinician', 'steward'] },
  { path: 'recovery', who: ['lead', 'clinician', 'steward', 'researcher'] },
  { path: 'addons', who: ['lead', 'clinician', 'researcher'] },
  { path: 'clinics', who: ['lead', 'steward', 'researcher'] },
] as const;

const allow = (who: readonly string[], status: number | readonly number[]) =>
  roles(Object.fromEntries(who.map((r) => [r, status])));

/** Aggregates: plain, registry-wide, and with the other clinic's id as filter (never its rows). */
export const analyticsEntries: Entry[] = [
  ...ENDPOINTS.flatMap(({ path, who }): Entry[] => [
    { method: 'GET', route: `/api/analytics/${path}`, expect: allow(who, 200) },
    {
      method: 'GET',
      route: `/api/analytics/${path}`,
      variant: 'filtered to the other clinic',
      url: (w, a) =>
        `/api/analytics/${path}?clinic=${a === 'otherLead' || a === 'otherClinician' ? w.clinicA.id : w.clinicB.id}`,
      // a clinic role may not ask for another clinic, nor a researcher for any single clinic; the steward may
      expect: { ...allow(who, 200), lead: 403, clinician: 403, researcher: 403 },
    },
  ]),
  {
    method: 'GET',
    route: '/api/analytics/episodes/:id/trajectory',
    url: (w) => `/api/analytics/episodes/${w.episodeA.id}/trajectory`,
    expect: roles({ lead: 200, clinician: 200, steward: 200 }),
    otherClinic: 'not-found',
  },
];
