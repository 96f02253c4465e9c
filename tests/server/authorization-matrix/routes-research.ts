import { ALLOWED, roles, type Entry } from './types';

/** Cohorts, data requests and de-identified exports (registry roles only). */
export const researchEntries: Entry[] = [
  { method: 'GET', route: '/api/cohorts', expect: roles({ researcher: 200, steward: 200 }) },
  {
    method: 'POST',
    route: '/api/cohorts/preview',
    body: () => ({ criteria: {} }),
    expect: roles({ researcher: 200, steward: 200 }),
  },
  {
    method: 'POST',
    route: '/api/cohorts',
    body: (w) => ({ name: `Matrix cohort ${w.unique()}`, criteria: {} }),
    expect: roles({ researcher: 201, steward: 201 }),
  },
  {
    method: 'GET',
    route: '/api/cohorts/:id',
    url: (w) => `/api/cohorts/${w.cohortId}`,
    expect: roles({ researcher: 200, steward: 200 }),
  },
  {
    method: 'PUT',
    route: '/api/cohorts/:id',
    url: (w) => `/api/cohorts/${w.cohortId}`,
    body: () => ({}),
    expect: roles({ researcher: ALLOWED, steward: ALLOWED }),
  },
  {
    method: 'POST',
    route: '/api/cohorts/:id/duplicate',
    url: (w) => `/api/cohorts/${w.cohortId}/duplicate`,
    body: () => ({}),
    expect: roles({ researcher: [200, 201], steward: [200, 201] }),
  },
  { method: 'GET', route: '/api/data-requests', expect: roles({ researcher: 200, steward: 200 }) },
  { method: 'POST', route: '/api/data-requests', body: () => ({}), expect: roles({ researcher: 422 }) },
  {
    method: 'POST',
    route: '/api/data-requests/:id/approve',
    url: (w) => `/api/data-requests/${w.dataRequestId}/approve`,
    body: () => ({}),
    expect: roles({ steward: ALLOWED }),
  },
  {
    method: 'POST',
    route: '/api/data-requests/:id/decline',
    url: (w) => `/api/data-requests/${w.dataRequestId}/decline`,
    body: () => ({}),
    expect: roles({ steward: 422 }),
  },
  // the files of an approved request are the requesting researcher's only (the steward approves, never downloads)
  {
    method: 'GET',
    route: '/api/data-requests/:id/dictionary',
    url: (w) => `/api/data-requests/${w.dataRequestId}/dictionary`,
    expect: roles({ researcher: 200 }),
  },
  {
    method: 'GET',
    route: '/api/data-requests/:id/export.csv',
    url: (w) => `/api/data-requests/${w.dataRequestId}/export.csv`,
    expect: roles({ researcher: 200 }),
  },
  { method: 'GET', route: '/api/exports', expect: roles({ steward: 200 }) },
];
