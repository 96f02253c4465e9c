import { sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../server/db/client';

/**
 * The registry's invariants, checked with plain SQL over the whole database (not through the services, so a
 * bug in them cannot hide itself). Each check lists up to five offending ids; an empty answer means consistent.
 */
const CHECKS: { name: string; query: SQL }[] = [
  {
    name: 'assessment without its episode',
    query: sql`select a.id from assessment a left join episode e on e.id = a.episode_id where e.id is null`,
  },
  {
    name: 'episode without exactly one baseline',
    query: sql`select e.id from episode e left join assessment a on a.episode_id = e.id and a.timepoint = 'baseline'
      group by e.id having count(a.id) <> 1`,
  },
  {
    name: 'score without its assessment',
    query: sql`select s.assessment_id as id from score s left join assessment a on a.id = s.assessment_id where a.id is null`,
  },
  {
    name: 'score outside its instrument’s range',
    query: sql`select s.assessment_id as id from score s join instrument i on i.id = s.instrument_id
      where s.value < i.min or s.value > i.max`,
  },
  {
    name: 'follow-up dated before its baseline',
    query: sql`select f.id from assessment f join assessment b on b.episode_id = f.episode_id and b.timepoint = 'baseline'
      where f.timepoint <> 'baseline' and f.assessed_on < b.assessed_on`,
  },
  {
    name: 'intervention of a missing episode',
    query: sql`select i.episode_id as id from episode_intervention i left join episode e on e.id = i.episode_id where e.id is null`,
  },
];

export async function consistencyProblems(db: Db): Promise<string[]> {
  const out: string[] = [];
  for (const c of CHECKS) {
    const r = await db.execute<{ id: number }>(sql`select id from (${c.query}) x order by id limit 5`);
    if (r.rows.length > 0) out.push(`${c.name}: ${r.rows.map((x) => x.id).join(', ')}${r.rows.length === 5 ? ', …' : ''}`);
  }
  return out;
}
