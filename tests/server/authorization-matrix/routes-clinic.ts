import { randomBytes } from 'node:crypto';
import { ALLOWED, everyone, roles, type Entry } from './types';

const FAKE_TOKEN = 'Y'.repeat(43);
const today = () => new Date().toISOString().slice(0, 10);

const newEpisode = (w: { unique(): string }) => ({
  pseudonym: randomBytes(32).toString('hex'),
  reference: `MX-${w.unique()}`,
  side: 'left',
  startDate: today(),
  symptomWeeks: 12,
  ageYears: 44,
  sex: 'female',
  heightCm: 170,
  weightKg: 72,
  activityProfile: 'active',
  standingWork: false,
  researchConsent: true,
  baseline: { assessedOn: today(), scores: { 'nprs-first-step': 6 } },
});

/** Episodes, uploads, reference data, follow-ups and self-report: the clinic's own data. */
export const clinicEntries: Entry[] = [
  { method: 'GET', route: '/api/episodes', expect: roles({ steward: 200, lead: 200, clinician: 200 }) },
  {
    method: 'GET',
    route: '/api/episodes',
    variant: "filtered to the other clinic's id",
    url: (w, a) =>
      `/api/episodes?clinicId=${a === 'otherLead' || a === 'otherClinician' ? w.clinicA.id : w.clinicB.id}`,
    expect: roles({ steward: 200, lead: [200, 403, 422], clinician: [200, 403, 422] }),
  },
  {
    method: 'GET',
    route: '/api/episodes',
    variant: "searching the other clinic's reference",
    url: (w) => `/api/episodes?q=${encodeURIComponent(w.episodeA.reference)}`,
    expect: roles({ steward: 200, lead: 200, clinician: 200 }),
  },
  { method: 'POST', route: '/api/episodes', body: (w) => newEpisode(w), expect: roles({ lead: 201, clinician: 201 }) },
  {
    method: 'GET',
    route: '/api/episodes/:id',
    url: (w) => `/api/episodes/${w.episodeA.id}`,
    expect: roles({ steward: 200, lead: 200, clinician: 200 }),
    otherClinic: 'not-found',
  },
  {
    method: 'PATCH',
    route: '/api/episodes/:id',
    url: (w) => `/api/episodes/${w.episodeA.id}`,
    // the version moves on with each accepted change, so a later caller may get the stale-version 409
    body: (w) => ({ version: w.episodeA.version, symptomWeeks: 13 }),
    expect: roles({ lead: [200, 409], clinician: [200, 409] }),
    otherClinic: 'not-found',
  },
  {
    method: 'POST',
    route: '/api/episodes/:id/assessments',
    url: (w) => `/api/episodes/${w.episodeA.id}/assessments`,
    body: () => ({ assessedOn: today(), timepoint: 'interim', scores: { 'nprs-first-step': 4 } }),
    expect: roles({ lead: [200, 201, 409], clinician: [200, 201, 409] }),
    otherClinic: 'not-found',
  },
  {
    method: 'PUT',
    route: '/api/episodes/:id/interventions',
    url: (w) => `/api/episodes/${w.episodeA.id}/interventions`,
    body: () => ({ interventions: [{ code: 'education-load', startWeek: 0 }] }),
    expect: roles({ lead: 200, clinician: 200 }),
    otherClinic: 'not-found',
  },
  {
    method: 'POST',
    route: '/api/episodes/:id/self-report-links',
    url: (w) => `/api/episodes/${w.episodeA.id}/self-report-links`,
    body: () => ({ timepoint: 'week6' }),
    expect: roles({ lead: [201, 409, 422], clinician: [201, 409, 422] }),
    otherClinic: 'not-found',
  },
  {
    method: 'GET',
    route: '/api/instruments',
    expect: roles({ steward: 200, lead: 200, clinician: 200, researcher: 200 }),
  },
  {
    method: 'GET',
    route: '/api/interventions',
    expect: roles({ steward: 200, lead: 200, clinician: 200, researcher: 200 }),
  },
  { method: 'GET', route: '/api/clinics/current/pseudonym-salt', expect: roles({ lead: 200, clinician: 200 }) },
  { method: 'GET', route: '/api/uploads/template.csv', expect: roles({ steward: 200, lead: 200, clinician: 200 }) },
  { method: 'GET', route: '/api/uploads', expect: roles({ steward: 200, lead: 200, clinician: 200 }) },
  {
    method: 'POST',
    route: '/api/uploads/episodes',
    body: () => ({}),
    expect: roles({ lead: ALLOWED, clinician: ALLOWED }),
  },
  { method: 'GET', route: '/api/follow-ups', expect: roles({ lead: 200, clinician: 200 }) },
  { method: 'GET', route: '/api/follow-ups/completeness', expect: roles({ lead: 200 }) },
  { method: 'GET', route: '/api/follow-ups/lost-proposals', expect: roles({ lead: 200 }) },
  {
    method: 'GET',
    route: '/api/self-report/:token',
    url: () => `/api/self-report/${FAKE_TOKEN}`,
    expect: everyone([404, 410]),
  },
  {
    method: 'POST',
    route: '/api/self-report/:token',
    url: () => `/api/self-report/${FAKE_TOKEN}`,
    body: () => ({}),
    expect: everyone([404, 410, 422]),
  },
  { method: 'GET', route: '/api/intervention-codes/proposals', expect: roles({ lead: 200 }) },
  { method: 'POST', route: '/api/intervention-codes/proposals', body: () => ({}), expect: roles({ lead: 422 }) },
];
