import { ALLOWED, everyone, roles, type Entry } from './types';

const FAKE_TOKEN = 'Z'.repeat(43);

/** Sign-in, invitations, accounts and the development outbox. */
export const authEntries: Entry[] = [
  { method: 'GET', route: '/api/health', expect: everyone(200) },
  { method: 'GET', route: '/api/auth/csrf', expect: everyone(200) },
  {
    method: 'POST',
    route: '/api/auth/login',
    body: (w) => ({ email: `nobody-${w.unique()}@test.loadline.test`, password: 'not-a-password' }),
    expect: everyone(401),
  },
  { method: 'POST', route: '/api/auth/logout', expect: everyone(204), endsSession: true },
  { method: 'GET', route: '/api/auth/me', expect: { ...everyone(200), anon: 401 } },
  {
    method: 'POST',
    route: '/api/auth/forgot',
    body: (w) => ({ email: `nobody-${w.unique()}@test.loadline.test` }),
    expect: everyone(202),
  },
  {
    method: 'POST',
    route: '/api/auth/reset',
    body: () => ({ token: FAKE_TOKEN, password: 'long-enough-password' }),
    expect: everyone(400),
  },
  {
    method: 'POST',
    route: '/api/invitations',
    // each role asks for what it could invite, so a 403 is about the caller, not the request
    body: (w, a) => ({
      email: `matrix-${w.unique()}@test.loadline.test`,
      role: a === 'steward' ? 'researcher' : 'clinician',
    }),
    expect: roles({ steward: 201, lead: 201 }),
  },
  {
    method: 'POST',
    route: '/api/invitations/accept',
    body: () => ({ token: FAKE_TOKEN, name: 'X', password: 'long-enough-password' }),
    expect: everyone(400),
  },
  {
    method: 'POST',
    route: '/api/invitations/:userId/resend',
    url: (w) => `/api/invitations/${w.pendingClinicianA}/resend`,
    expect: roles({ steward: 200, lead: 200 }),
    otherClinic: 'not-found',
  },
  { method: 'GET', route: '/api/users', expect: roles({ steward: 200, lead: 200 }) },
  {
    method: 'POST',
    route: '/api/users/:id/deactivate',
    url: (w) => `/api/users/${w.spareClinicianA}/deactivate`,
    expect: roles({ steward: 200, lead: 200 }),
    otherClinic: 'not-found',
  },
  { method: 'GET', route: '/api/dev/outbox', expect: roles({ steward: 200 }) },
  { method: 'GET', route: '/api/me/preferences', expect: { ...everyone(200), anon: 401 } },
  {
    method: 'PATCH',
    route: '/api/me/preferences',
    body: () => ({ digestOptOut: false }),
    expect: { ...everyone(ALLOWED), anon: 401 },
  },
];
