import { EpisodeListQuerySchema, type EpisodeListQuery } from '../../../shared/schemas/episode';

export const PAGE_SIZE = 25;
type Sort = EpisodeListQuery['sort'];
type Order = EpisodeListQuery['order'];

/** The list's state as kept in the address bar: what a shared or reloaded link shows. */
export type ListState = { page: number; sort: Sort; order: Order; status: EpisodeListQuery['status']; q: string };

const shape = EpisodeListQuerySchema.shape;

/** Reads the state from search params; a value that does not parse falls back to the default. */
export function readListState(sp: URLSearchParams): ListState {
  const page = Number(sp.get('page'));
  const sort = shape.sort.safeParse(sp.get('sort') ?? undefined);
  const order = shape.order.safeParse(sp.get('order') ?? undefined);
  const status = shape.status.safeParse(sp.get('status') || undefined);
  const q = shape.q.safeParse(sp.get('q') ?? undefined);
  return {
    page: Number.isInteger(page) && page >= 1 ? page : 1,
    sort: sort.success ? sort.data : 'startDate',
    order: order.success ? order.data : 'desc',
    status: status.success ? status.data : undefined,
    q: q.success ? (q.data ?? '') : '',
  };
}

/** Search params for a state; defaults are left out so plain links stay plain. */
export function writeListState(s: ListState): URLSearchParams {
  const sp = new URLSearchParams();
  if (s.page > 1) sp.set('page', String(s.page));
  if (s.sort !== 'startDate') sp.set('sort', s.sort);
  if (s.order !== 'desc') sp.set('order', s.order);
  if (s.status) sp.set('status', s.status);
  if (s.q) sp.set('q', s.q);
  return sp;
}

/** The API query for a state. */
export function toListQuery(s: ListState): EpisodeListQuery {
  return {
    limit: PAGE_SIZE,
    offset: (s.page - 1) * PAGE_SIZE,
    sort: s.sort,
    order: s.order,
    ...(s.status ? { status: s.status } : {}),
    ...(s.q ? { q: s.q } : {}),
  };
}
