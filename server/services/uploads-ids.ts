import { sql } from 'drizzle-orm';
import type { Tx } from './audit';

/**
 * Ids for new episodes and assessments, taken from the tables' own sequences ahead of the rows that get them,
 * so a chunk's COPY text (children naming their parents) can be made while the previous chunk is still being
 * written. `ensure` tops the pool up to a chunk's most possible need; ids left over when the upload ends are
 * gaps in the sequence, as a rolled-back insert leaves (at most one chunk's worth).
 */
export class IdPool {
  private episodes: number[] = [];
  private assessments: number[] = [];
  private e = 0;
  private a = 0;

  async ensure(tx: Tx, episodes: number, assessments: number): Promise<void> {
    const moreE = Math.max(0, episodes - (this.episodes.length - this.e));
    const moreA = Math.max(0, assessments - (this.assessments.length - this.a));
    if (moreE === 0 && moreA === 0) return;
    const r = await tx.execute<{ e: number[]; a: number[] }>(sql`
      select array(select nextval('episode_id_seq'::regclass)::int from generate_series(1, ${moreE}::int)) as e,
        array(select nextval('assessment_id_seq'::regclass)::int from generate_series(1, ${moreA}::int)) as a`);
    this.episodes = [...this.episodes.slice(this.e), ...r.rows[0]!.e];
    this.assessments = [...this.assessments.slice(this.a), ...r.rows[0]!.a];
    this.e = 0;
    this.a = 0;
  }

  episode(): number {
    if (this.e >= this.episodes.length) throw new Error('no episode id reserved');
    return this.episodes[this.e++]!;
  }

  assessment(): number {
    if (this.a >= this.assessments.length) throw new Error('no assessment id reserved');
    return this.assessments[this.a++]!;
  }
}
