import type { Role } from '../../../shared/roles';

/**
 * The authorisation matrix: one entry per (method, route) of the API, with the request to make and
 * the status each kind of caller must get. To add a route: add an entry to the file of its area
 * (or a new file listed in index.ts). The test fails for any mounted route without an entry.
 */

/** Who calls: signed out, each role of clinic A (or the registry), and the lead/clinician of clinic B. */
export type Actor = 'anon' | Role | 'otherLead' | 'otherClinician';
export const ACTORS: readonly Actor[] = [
  'anon',
  'steward',
  'researcher',
  'lead',
  'clinician',
  'otherLead',
  'otherClinician',
];

/** An exact status, one of several, or ALLOWED: authorisation passed (any status below 500 but 401/403). */
export const ALLOWED = 'allowed' as const;
export type Expected = number | readonly number[] | typeof ALLOWED;

export type World = {
  clinicA: { id: number; code: string; displayName: string };
  clinicB: { id: number; code: string; displayName: string };
  /** Rows of clinic A the routes address by id; clinic B's callers must get 404 for them. */
  episodeA: { id: number; version: number; reference: string };
  /** A clinician of clinic A who has not accepted their invitation (resend / deactivate target). */
  pendingClinicianA: number;
  /** Another active clinician of clinic A (deactivate target). */
  spareClinicianA: number;
  /** A person of clinic A for the steward's people edits. */
  userIdA: number;
  cohortId: number;
  dataRequestId: number;
  instrumentId: number;
  interventionCodeId: number;
  /** A fresh suffix for e-mails and names created by a request. */
  unique(): string;
};

export type Entry = {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** The route exactly as Express has it mounted, e.g. '/api/episodes/:id'. */
  route: string;
  /** A name when a route has several entries (e.g. with a clinic filter). */
  variant?: string;
  /** The concrete address (default: `route`). */
  url?: (w: World, actor: Actor) => string;
  body?: (w: World, actor: Actor) => unknown;
  /** The status per caller. Missing base roles: 403; missing anon: 401; other-clinic callers: see `otherClinic`. */
  expect: Partial<Record<Actor, Expected>>;
  /**
   * How clinic B's callers are judged when not listed in `expect`: 'same' (default) = like the
   * same role of clinic A; 'not-found' = the url addresses a clinic-A row, so 404 where their role is let in.
   */
  otherClinic?: 'same' | 'not-found';
  /** The request ends the caller's session (sign-out, reset): it runs on a fresh session. */
  endsSession?: boolean;
};

/** Statuses for the given roles; every other role 403, signed out 401. */
export function roles(allowed: Partial<Record<Role, Expected>>): Partial<Record<Actor, Expected>> {
  return { anon: 401, steward: 403, researcher: 403, lead: 403, clinician: 403, ...allowed };
}

/** Every caller gets the same status (public routes). */
export const everyone = (status: Expected): Partial<Record<Actor, Expected>> =>
  Object.fromEntries(ACTORS.map((a) => [a, status]));
