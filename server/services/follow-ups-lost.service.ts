import type { LostProposal } from '../../shared/schemas/follow-ups';
import { daysWithoutAssessment } from '../../shared/follow-up-schedule';
import type { Db } from '../db/client';
import type { Scope } from '../db/scope';
import { clinicIdOf, openEpisodesOf } from './follow-ups.service';

/**
 * GET /api/follow-ups/lost-proposals: open episodes of the caller's clinic with no assessment for 26 weeks.
 * Only proposed: the lead decides, and the status changes through the episode's own PATCH with its version.
 */
export async function lostProposals(
  db: Db,
  scope: Scope,
  today: string,
): Promise<{ items: LostProposal[]; total: number }> {
  const open = await openEpisodesOf(db, clinicIdOf(scope));
  const items = open
    .map((e) => ({ e, days: daysWithoutAssessment(e.startDate, e.lastAssessedOn, today) }))
    .filter((x): x is { e: (typeof open)[number]; days: number } => x.days !== null)
    .sort((a, b) => b.days - a.days || a.e.reference.localeCompare(b.e.reference))
    .map(({ e, days }) => ({
      episodeId: e.id,
      reference: e.reference,
      startDate: e.startDate,
      lastAssessedOn: e.lastAssessedOn,
      daysWithoutAssessment: days,
      version: e.version,
    }));
  return { items, total: items.length };
}
