import pg from 'pg';
import Cursor from 'pg-cursor';
import type { Db } from '../../db/client';
import { onOwnConnection } from '../../db/client-transaction';
import { cursorBatches } from '../../db/cursor-batches';
import { deriveFacts, type DeriveContext, type EpisodeFacts, type FactsRow } from './derive';

/**
 * The episode-facts query: one row per consenting episode with its scores and interventions aggregated.
 * Non-consenting episodes are filtered here, in SQL, so they never reach cohort code at all.
 * Only fixed text goes into it (no caller input), so it needs no parameters.
 */
export function factsQuery(opts: { scores: boolean }): string {
  // Scores travel as one space-separated text per episode ("day isBaseline instrumentId value assessmentId …"):
  // string_agg builds it at about half the cost of json_agg, and splitting it is cheaper than JSON.parse.
  const scores = opts.scores
    ? `(select string_agg(concat_ws(' ', a.assessed_on - e.start_date, (a.timepoint = 'baseline')::int, s.instrument_id, s.value, a.id), ' ')
         from assessment a join score s on s.assessment_id = a.id where a.episode_id = e.id)`
    : 'null::text';
  return `select e.id, e.clinic_id, c.region, e.condition_code, e.start_date, e.age_years, e.sex, e.height_cm, e.weight_kg,
      e.activity_profile, e.standing_work, e.side, e.symptom_weeks, e.research_consent, e.status, e.discharge_reason,
      (e.discharge_date - e.start_date) as discharge_day,
      ${scores} as scores,
      (select array_agg(ei.intervention_code_id) from episode_intervention ei where ei.episode_id = e.id) as interventions
    from episode e join clinic c on c.id = e.clinic_id
    where e.research_consent
    order by e.id`;
}


/**
 * Runs `fn` on one connection inside a read-only REPEATABLE READ transaction, so every query in it (the counts,
 * both passes of an export) sees the same snapshot even while clinics keep writing.
 */
export async function withSnapshot<T>(db: Db, fn: (client: pg.PoolClient) => Promise<T>): Promise<T> {
  // JIT compilation costs more than it saves on these one-pass scans.
  return onOwnConnection(db, ['begin isolation level repeatable read read only', 'set local jit = off'], fn);
}

/** Consenting and all episodes, for the first line of the flow diagram. */
export async function episodeTotals(client: pg.PoolClient): Promise<{ total: number; consenting: number }> {
  const { rows } = await client.query<{ total: number; consenting: number }>(
    'select count(*)::int as total, (count(*) filter (where research_consent))::int as consenting from episode',
  );
  return { total: rows[0]?.total ?? 0, consenting: rows[0]?.consenting ?? 0 };
}

/** Facts made one at a time as the consumer asks, so each dies young (less for the garbage collector to move). */
function* derived(rows: readonly FactsRow[], ctx: DeriveContext): Generator<EpisodeFacts> {
  for (const r of rows) yield deriveFacts(r, ctx);
}

/**
 * Streams the facts of every consenting episode in batches through a server-side cursor: memory stays at one
 * batch however large the registry is. Closing the generator early closes the cursor.
 */
export async function* scanFacts(
  client: pg.PoolClient,
  ctx: DeriveContext,
  opts: { scores: boolean; batchSize?: number },
): AsyncGenerator<Iterable<EpisodeFacts>> {
  const size = opts.batchSize ?? 250;
  const cursor = client.query(new Cursor<FactsRow>(factsQuery(opts)));
  for await (const rows of cursorBatches(cursor, size)) yield derived(rows, ctx);
}
