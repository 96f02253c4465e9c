import { ALLOWED, roles, type Entry } from './types';

const steward = (status: number | typeof ALLOWED = 200) => roles({ steward: status });

/** The steward's console, registry rules and the audit trail. */
export const adminEntries: Entry[] = [
  { method: 'GET', route: '/api/admin/clinics', expect: steward() },
  {
    method: 'GET',
    route: '/api/admin/clinics/:id',
    url: (w) => `/api/admin/clinics/${w.clinicA.id}`,
    expect: steward(),
  },
  { method: 'POST', route: '/api/admin/clinics', body: () => ({}), expect: steward(422) },
  {
    method: 'PATCH',
    route: '/api/admin/clinics/:id',
    url: (w) => `/api/admin/clinics/${w.clinicA.id}`,
    body: () => ({ region: 'Matrix region' }),
    expect: steward(ALLOWED),
  },
  // a clinic that does not exist: deactivating a real one would lock its people out mid-test
  {
    method: 'POST',
    route: '/api/admin/clinics/:id/deactivate',
    url: () => '/api/admin/clinics/999999/deactivate',
    body: () => ({}),
    expect: steward(ALLOWED),
  },
  {
    method: 'POST',
    route: '/api/admin/clinics/:id/reactivate',
    url: () => '/api/admin/clinics/999999/reactivate',
    body: () => ({}),
    expect: steward(ALLOWED),
  },
  { method: 'GET', route: '/api/admin/people', expect: roles({ steward: 200, lead: 200 }) },
  {
    method: 'PATCH',
    route: '/api/admin/people/:id',
    url: (w) => `/api/admin/people/${w.userIdA}`,
    body: () => ({}),
    expect: steward(ALLOWED),
  },
  { method: 'GET', route: '/api/admin/instruments', expect: steward() },
  { method: 'POST', route: '/api/admin/instruments', body: () => ({}), expect: steward(422) },
  {
    method: 'PATCH',
    route: '/api/admin/instruments/:id',
    url: (w) => `/api/admin/instruments/${w.instrumentId}`,
    body: () => ({}),
    expect: steward(ALLOWED),
  },
  {
    method: 'PUT',
    route: '/api/admin/instruments/:id/mcid',
    url: (w) => `/api/admin/instruments/${w.instrumentId}/mcid`,
    body: () => ({}),
    expect: steward(ALLOWED),
  },
  {
    method: 'POST',
    route: '/api/admin/instruments/:id/retire',
    url: () => '/api/admin/instruments/999999/retire',
    body: () => ({}),
    expect: steward(ALLOWED),
  },
  {
    method: 'POST',
    route: '/api/admin/instruments/:id/reinstate',
    url: () => '/api/admin/instruments/999999/reinstate',
    body: () => ({}),
    expect: steward(ALLOWED),
  },
  {
    method: 'DELETE',
    route: '/api/admin/instruments/:id',
    url: () => '/api/admin/instruments/999999',
    expect: steward(ALLOWED),
  },
  { method: 'GET', route: '/api/admin/intervention-codes', expect: steward() },
  { method: 'POST', route: '/api/admin/intervention-codes', body: () => ({}), expect: steward(422) },
  {
    method: 'PATCH',
    route: '/api/admin/intervention-codes/:id',
    url: (w) => `/api/admin/intervention-codes/${w.interventionCodeId}`,
    body: () => ({}),
    expect: steward(ALLOWED),
  },
  {
    method: 'POST',
    route: '/api/admin/intervention-codes/:id/decision',
    url: () => '/api/admin/intervention-codes/999999/decision',
    body: () => ({}),
    expect: steward(ALLOWED),
  },
  {
    method: 'GET',
    route: '/api/rules/current',
    expect: { ...roles({ steward: 200, lead: 200, clinician: 200, researcher: 200 }) },
  },
  { method: 'GET', route: '/api/admin/rules', expect: steward() },
  { method: 'PUT', route: '/api/admin/rules', body: () => ({}), expect: steward(422) },
  { method: 'GET', route: '/api/audit', expect: roles({ steward: 200, lead: 200 }) },
  { method: 'GET', route: '/api/audit/facets', expect: roles({ steward: 200, lead: 200 }) },
  { method: 'GET', route: '/api/audit/export.csv', expect: roles({ steward: 200, lead: 200 }) },
];
