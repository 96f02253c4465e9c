import { PeopleQuerySchema, type PeopleQuery } from '../../../../shared/schemas/admin';

export const PEOPLE_PAGE_SIZE = 25;

/** The people list's filters as kept in the address bar. */
export type PeopleState = {
  page: number;
  clinicId?: number;
  role?: PeopleQuery['role'];
  status?: PeopleQuery['status'];
  q: string;
};

const shape = PeopleQuerySchema.shape;

export function readPeopleState(sp: URLSearchParams): PeopleState {
  const page = Number(sp.get('page'));
  const clinicId = shape.clinicId.safeParse(sp.get('clinic') || undefined);
  const role = shape.role.safeParse(sp.get('role') || undefined);
  const status = shape.status.safeParse(sp.get('status') || undefined);
  return {
    page: Number.isInteger(page) && page >= 1 ? page : 1,
    clinicId: clinicId.success ? clinicId.data : undefined,
    role: role.success ? role.data : undefined,
    status: status.success ? status.data : undefined,
    q: (sp.get('q') ?? '').slice(0, 80),
  };
}

export function writePeopleState(s: PeopleState): URLSearchParams {
  const sp = new URLSearchParams();
  if (s.page > 1) sp.set('page', String(s.page));
  if (s.clinicId) sp.set('clinic', String(s.clinicId));
  if (s.role) sp.set('role', s.role);
  if (s.status) sp.set('status', s.status);
  if (s.q) sp.set('q', s.q);
  return sp;
}

export const toPeopleQuery = (s: PeopleState): PeopleQuery => ({
  limit: PEOPLE_PAGE_SIZE,
  offset: (s.page - 1) * PEOPLE_PAGE_SIZE,
  ...(s.clinicId ? { clinicId: s.clinicId } : {}),
  ...(s.role ? { role: s.role } : {}),
  ...(s.status ? { status: s.status } : {}),
  ...(s.q ? { q: s.q } : {}),
});

export const STATUS_WORDS = {
  invited: 'Invited, not yet joined',
  active: 'Active',
  deactivated: 'Deactivated',
} as const;
