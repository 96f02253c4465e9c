import { createHash, randomBytes } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { SelfReportLinkCreateSchema, selfReportPath, type SelfReportLink } from '../../shared/schemas/follow-ups';
import type { Db } from '../db/client';
import type { Scope } from '../db/scope';
import { episodes, selfReportLinks } from '../db/schema';
import { NotFoundError } from '../errors';
import { audit } from './audit';
import { clinicIdOf } from './follow-ups.service';

/** How long a self-report link works (registry setting: two weeks covers a follow-up window's closing fortnight). */
export const SELF_REPORT_LINK_DAYS = 14;

/** The stored form of a token: its SHA-256 in hex. The token itself is never stored or logged. */
export const hashSelfReportToken = (token: string): string => createHash('sha256').update(token, 'utf8').digest('hex');

/**
 * POST /api/episodes/:id/self-report-links: a single-use link for one episode and timepoint of the caller's clinic.
 * Another clinic's episode is "not found", never "forbidden", so ids do not reveal what exists elsewhere.
 */
export async function createSelfReportLink(
  db: Db,
  scope: Scope,
  episodeId: number,
  raw: unknown,
  baseUrl: string,
  now: Date = new Date(),
): Promise<SelfReportLink> {
  const clinicId = clinicIdOf(scope);
  const { timepoint } = SelfReportLinkCreateSchema.parse(raw);
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(now.getTime() + SELF_REPORT_LINK_DAYS * 86_400_000);
  return db.transaction(async (tx) => {
    const [episode] = await tx
      .select({ id: episodes.id })
      .from(episodes)
      .where(and(eq(episodes.id, episodeId), eq(episodes.clinicId, clinicId)));
    if (!episode) throw new NotFoundError('No such episode in your clinic');
    const [link] = await tx
      .insert(selfReportLinks)
      .values({ episodeId, timepoint, tokenHash: hashSelfReportToken(token), createdBy: scope.userId, expiresAt })
      .returning({ id: selfReportLinks.id });
    await audit(tx, {
      actorId: scope.userId,
      clinicId,
      action: 'create',
      entity: 'self-report-link',
      entityId: link!.id,
      detail: { episodeId, timepoint, expiresAt: expiresAt.toISOString() },
    });
    return { url: new URL(selfReportPath(token), baseUrl).toString(), expiresAt: expiresAt.toISOString() };
  });
}
