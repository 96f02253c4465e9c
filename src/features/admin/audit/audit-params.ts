import { AuditQuerySchema, type AuditQuery } from '../../../../shared/schemas/admin';
import { IsoDateSchema } from '../../../../shared/schemas/episode';

export const AUDIT_PAGE_SIZE = 50;

/** The trail's filters as kept in the address bar (a shared link shows the same view). */
export type AuditState = { page: number; actor: string; action: string; entity: string; from: string; to: string };

const day = (v: string | null) => (v && IsoDateSchema.safeParse(v).success ? v : '');
const short = (v: string | null, max: number) => (v ?? '').trim().slice(0, max);

export function readAuditState(sp: URLSearchParams): AuditState {
  const page = Number(sp.get('page'));
  return {
    page: Number.isInteger(page) && page >= 1 ? page : 1,
    actor: short(sp.get('actor'), 120),
    action: short(sp.get('action'), 60),
    entity: short(sp.get('entity'), 60),
    from: day(sp.get('from')),
    to: day(sp.get('to')),
  };
}

export function writeAuditState(s: AuditState): URLSearchParams {
  const sp = new URLSearchParams();
  if (s.page > 1) sp.set('page', String(s.page));
  for (const k of ['actor', 'action', 'entity', 'from', 'to'] as const) if (s[k]) sp.set(k, s[k]);
  return sp;
}

/** The API query; a reversed date range is dropped here rather than sent for a 422. */
export function toAuditQuery(s: AuditState): AuditQuery {
  const q = {
    limit: AUDIT_PAGE_SIZE,
    offset: (s.page - 1) * AUDIT_PAGE_SIZE,
    ...(s.actor ? { actor: s.actor } : {}),
    ...(s.action ? { action: s.action } : {}),
    ...(s.entity ? { entity: s.entity } : {}),
    ...(s.from ? { from: s.from } : {}),
    ...(s.to ? { to: s.to } : {}),
  };
  return AuditQuerySchema.safeParse(q).success ? q : { ...q, to: undefined };
}
