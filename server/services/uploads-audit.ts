import type { UploadChanges } from '../../shared/schemas/upload';
import type { Plan } from './uploads-plan';

const LIST_LIMIT = 200;

type EpisodeChange = {
  reference: string;
  episodeId?: number;
  fields?: string[];
  interventions?: true;
  assessments: { timepoint: string; assessedOn: string; change: 'created' | 'updated'; fields?: string[] }[];
};

/**
 * Totals of an upload, added up plan by plan (an upload is planned in chunks of episodes), and a compact
 * "what changed" for its audit event: created episodes by reference, and for updated ones the fields and
 * assessments that changed (no values, never the pseudonym). Lists stop at 200 entries; the counts do not.
 */
export class UploadSummary {
  readonly changes: UploadChanges = { episodesCreated: 0, episodesUpdated: 0, assessmentsCreated: 0, assessmentsUpdated: 0, rowsUnchanged: 0 };
  readonly rejectedRows = new Set<number>();
  private readonly created: string[] = [];
  private readonly updated: EpisodeChange[] = [];
  private createdCount = 0;
  private updatedCount = 0;

  add(plan: Plan): void {
    const c = this.changes;
    c.rowsUnchanged += plan.rowsUnchanged;
    for (const r of plan.rejectedRows) this.rejectedRows.add(r);
    const changed = new Map<string, EpisodeChange>();
    const entry = (reference: string, episodeId: number | undefined) => {
      let e = changed.get(reference);
      if (!e) changed.set(reference, (e = { reference, ...(episodeId ? { episodeId } : {}), assessments: [] }));
      return e;
    };
    const createdHere = new Set<string>();
    for (const e of plan.episodes) {
      if (!e.stored) {
        c.episodesCreated++;
        createdHere.add(e.reference);
        if (this.created.length < LIST_LIMIT) this.created.push(e.reference);
        continue;
      }
      if (e.changed.length > 0) c.episodesUpdated++;
      const x = entry(e.reference, e.stored.id);
      if (e.changed.length > 0) x.fields = e.changed;
      if (e.interventions) x.interventions = true;
    }
    for (const a of plan.assessments) {
      if (a.stored) c.assessmentsUpdated++;
      else c.assessmentsCreated++;
      if (createdHere.has(a.reference)) continue;
      entry(a.reference, a.episodeId).assessments.push({
        timepoint: a.timepoint,
        assessedOn: a.assessedOn,
        change: a.stored ? 'updated' : 'created',
        ...(a.stored ? { fields: a.changed } : {}),
      });
    }
    this.createdCount = c.episodesCreated;
    for (const x of changed.values()) {
      this.updatedCount++;
      if (this.updated.length < LIST_LIMIT) this.updated.push(x);
    }
  }

  /** The audit event's detail. */
  detail(): Record<string, unknown> {
    return {
      ...this.changes,
      createdEpisodes: this.created,
      createdEpisodesNotListed: this.createdCount - this.created.length,
      changedEpisodes: this.updated,
      changedEpisodesNotListed: this.updatedCount - this.updated.length,
    };
  }
}
