import { sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../server/db/client';

/**
 * The registry's invariants, checked with plain SQL over the database (not through the services, so a bug in them
 * cannot hide itself). Each check lists up to five offending ids with their clinic (none for orphans); an empty
 * answer means consistent. `clinicIds` limits the checks to those clinics' episodes: the integration tests share
 * one database, in which other files' fixtures may insert rows on purpose that a real clinic never could.
 */
const CHECKS: { name: string; query: SQL }[] = [
  {
    name: 'assessment without its episode',
    query: sql`select a.id, null::int as clinic_id from assessment a left join episode e on e.id = a.episode_id where e.id is null`,
  },
  {
    name: 'episode without exactly one baseline',
    query: sql`select e.id, e.clinic_id from episode e left join assessment a on a.episode_id = e.id and a.timepoint = 'baseline'
      group by e.id having count(a.id) <> 1`,
  },
  {
    name: 'score without its assessment',
    query: sql`select s.assessment_id as id, null::int as clinic_id from score s left join assessment a on a.id = s.assessment_id where a.id is null`,
  },
  {
    name: 'score outside its instrument’s range',
    query: sql`select s.assessment_id as id, e.clinic_id from score s join instrument i on i.id = s.instrument_id
      join assessment a on a.id = s.assessment_id join episode e on e.id = a.episode_id
      where s.value < i.min or s.value > i.max`,
  },
  {
    name: 'follow-up dated before its baseline',
    query: sql`select f.id, e.clinic_id from assessment f join assessment b on b.episode_id = f.episode_id and b.timepoint = 'baseline'
      join episode e on e.id = f.episode_id where f.timepoint <> 'baseline' and f.assessed_on < b.assessed_on`,
  },
  {
    name: 'intervention of a missing episode',
    query: sql`select i.episode_id as id, null::int as clinic_id from episode_intervention i left join episode e on e.id = i.episode_id where e.id is null`,
  },
];

export async function consistencyProblems(db: Db, clinicIds?: number[]): Promise<string[]> {
  const only = clinicIds ? sql`where x.clinic_id is null or x.clinic_id = any(${sql.param(clinicIds)}::int[])` : sql``;
  const out: string[] = [];
  for (const c of CHECKS) {
    const r = await db.execute<{ id: number }>(sql`select x.id from (${c.query}) x ${only} order by x.id limit 5`);
    if (r.rows.length > 0) out.push(`${c.name}: ${r.rows.map((x) => x.id).join(', ')}${r.rows.length === 5 ? ', …' : ''}`);
  }
  return out;
}
