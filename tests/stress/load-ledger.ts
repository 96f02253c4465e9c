import { inArray, sql } from 'drizzle-orm';
import type { Db } from '../../server/db/client';
import { assessments, auditEvents, episodes, uploads } from '../../server/db/schema';

/** An episode the server acknowledged (201 to the form, or part of a 200 upload), as the client knows it. */
export type AckedEpisode = {
  clinicId: number;
  reference: string;
  source: 'form' | 'upload';
  /** Acknowledged follow-ups ("timepoint|date"); uploads add their own rows (counted in `uploadRows`). */
  followUps: Set<string>;
  uploadRows: number;
  version: number;
  symptomWeeks: number;
};

/**
 * Every write the server acknowledged during a load run. Afterwards `missing(db)` compares it with the database:
 * an acknowledged write that is not stored is lost; a stored row nobody was told about is a duplicate or phantom.
 */
export class Ledger {
  readonly episodes = new Map<string, AckedEpisode>();
  readonly uploadIds: number[] = [];
  /** Acknowledged audited writes per clinic (each writes one audit event in its transaction). */
  readonly writes = new Map<number, number>();

  ack(clinicId: number): void {
    this.writes.set(clinicId, (this.writes.get(clinicId) ?? 0) + 1);
  }

  async problems(db: Db, clinicIds: number[]): Promise<string[]> {
    const out: string[] = [];
    const stored = await db
      .select({ id: episodes.id, clinicId: episodes.clinicId, reference: episodes.reference, version: episodes.version, symptomWeeks: episodes.symptomWeeks })
      .from(episodes)
      .where(inArray(episodes.clinicId, clinicIds));
    const byKey = new Map(stored.map((e) => [`${e.clinicId}|${e.reference}`, e]));
    if (stored.length !== this.episodes.size) out.push(`episodes: ${this.episodes.size} acknowledged, ${stored.length} stored`);
    for (const [key, a] of this.episodes) {
      const s = byKey.get(key);
      if (!s) out.push(`lost episode ${key}`);
      else if (a.source === 'form' && (s.version !== a.version || s.symptomWeeks !== a.symptomWeeks)) {
        out.push(`episode ${key}: acknowledged version ${a.version} (symptom weeks ${a.symptomWeeks}), stored ${s.version} (${s.symptomWeeks})`);
      }
    }
    for (const key of byKey.keys()) if (!this.episodes.has(key)) out.push(`episode nobody was told about: ${key}`);

    const rows = stored.length
      ? await db
          .select({ episodeId: assessments.episodeId, timepoint: assessments.timepoint, on: assessments.assessedOn })
          .from(assessments)
          .where(inArray(assessments.episodeId, stored.map((e) => e.id)))
      : [];
    const keyOfId = new Map(stored.map((e) => [e.id, `${e.clinicId}|${e.reference}`]));
    const asm = new Map<string, string[]>();
    for (const r of rows) {
      const k = keyOfId.get(r.episodeId)!;
      asm.set(k, [...(asm.get(k) ?? []), `${r.timepoint}|${r.on}`]);
    }
    let expected = 0;
    for (const [key, a] of this.episodes) {
      const have = asm.get(key) ?? [];
      const want = a.source === 'form' ? 1 + a.followUps.size : a.uploadRows;
      expected += want;
      if (have.length !== want) out.push(`episode ${key}: ${want} assessments acknowledged, ${have.length} stored`);
      for (const f of a.followUps) if (!have.includes(f)) out.push(`lost follow-up ${key} ${f}`);
    }
    if (rows.length !== expected) out.push(`assessments: ${expected} acknowledged, ${rows.length} stored`);

    const ups = await db.select({ id: uploads.id }).from(uploads).where(inArray(uploads.clinicId, clinicIds));
    const upIds = new Set(ups.map((u) => u.id));
    if (ups.length !== this.uploadIds.length || this.uploadIds.some((id) => !upIds.has(id))) {
      out.push(`uploads: ${this.uploadIds.length} acknowledged, ${ups.length} stored`);
    }
    const audits = await db
      .select({ clinicId: auditEvents.clinicId, n: sql<number>`count(*)::int` })
      .from(auditEvents)
      .where(sql`${inArray(auditEvents.clinicId, clinicIds)} and ${auditEvents.entity} in ('episode', 'assessment', 'upload')`)
      .groupBy(auditEvents.clinicId);
    for (const id of clinicIds) {
      const n = audits.find((a) => a.clinicId === id)?.n ?? 0;
      if (n !== (this.writes.get(id) ?? 0)) out.push(`clinic ${id}: ${this.writes.get(id) ?? 0} audited writes acknowledged, ${n} audit events`);
    }
    return out;
  }
}
