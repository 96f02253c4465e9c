import type pg from 'pg';
import Cursor from 'pg-cursor';
import { cursorBatches } from '../../db/cursor-batches';
import type { FactsRow } from '../cohorts/derive';
import { decodeRow } from './facts-row-text';

/** What one pass of an export reads besides the episode itself (each an aggregate over a large table). */
export type ScanNeeds = { scores: boolean; interventions: boolean };

/**
 * The export's facts query: the cohort engine's episode facts, but scores and interventions only when the pass
 * needs them (the counting pass of a cohort defined on episode fields reads neither).
 *
 * Measured choices (100,000 episodes): scores and interventions are aggregated per episode in episode order and
 * merged with the episodes (with `MERGE_PLAN`), not looked up per episode by correlated subqueries, which cost
 * about a fifth more PostgreSQL time. Reading a field costs the driver about as much as formatting a cell, so a
 * row is two fields: the numbers, the start date and the intervention ids as one space-separated text (none of
 * them can hold a space) followed by the text fields, each after a unit separator (U+001F), then the score text
 * (measured: 104-166 ms of Node CPU to read the counting pass's rows, against 129-224 ms with one field per text);
 * the region comes from the clinic table once. Both passes see the same rows in the same order (one snapshot,
 * `order by e.id`). Only fixed text goes into it: no parameters.
 */
export function exportFactsQuery(needs: ScanNeeds): string {
  const scores = needs.scores
    ? `left join (select a.episode_id, string_agg(concat_ws(' ', a.assessed_on - e2.start_date,
          (a.timepoint = 'baseline')::int, s.instrument_id, s.value, a.id), ' ') as t
        from episode e2 join assessment a on a.episode_id = e2.id join score s on s.assessment_id = a.id
        where e2.research_consent group by a.episode_id) sc on sc.episode_id = e.id`
    : '';
  const interventions = needs.interventions
    ? `left join (select episode_id, string_agg(intervention_code_id::text, ' ') as t
        from episode_intervention group by episode_id) iv on iv.episode_id = e.id`
    : '';
  return `select concat_ws(E'\\x1f', concat_ws(' ', e.id, e.clinic_id, e.start_date, e.age_years, e.height_cm, e.weight_kg,
        e.symptom_weeks, e.standing_work::int, e.research_consent::int, coalesce((e.discharge_date - e.start_date)::text, ''),
        ${needs.interventions ? 'iv.t' : 'null'}),
        e.condition_code, e.sex, e.activity_profile, e.side, e.status, coalesce(e.discharge_reason, '')),
      ${needs.scores ? 'sc.t' : 'null'}
    from episode e ${scores} ${interventions}
    where e.research_consent
    order by e.id`;
}

/**
 * The grouped joins above stream in episode order through the primary-key and episode indexes (merge joins,
 * group aggregates: no sort, little memory). Left to itself the planner hashes all scores of the registry
 * first, which spills to disk at the default work_mem and was still slower at 128 MB; these settings hold for
 * the export's own read-only transaction only.
 */
const MERGE_PLAN = ['set local enable_hashagg = off', 'set local enable_hashjoin = off'];

/**
 * Rows per cursor read. Each read is a round trip to PostgreSQL, so small batches leave both sides waiting on
 * each other; 1,000 facts rows are well under a megabyte, so memory stays flat whatever the registry's size.
 */
const BATCH = 1000;

/**
 * Streams the facts rows of every consenting episode, batch by batch, through a server-side cursor. The next
 * batch is asked for before this one is handed over, so PostgreSQL computes it while Node formats this one.
 * Closing the generator early closes the cursor.
 */
export async function* scanExportRows(client: pg.PoolClient, needs: ScanNeeds): AsyncGenerator<Iterable<FactsRow>> {
  for (const setting of MERGE_PLAN) await client.query(setting);
  const { rows: clinics } = await client.query<{ id: number; region: string }>('select id, region from clinic');
  const regionOf = new Map(clinics.map((c) => [c.id, c.region]));
  const cursor = client.query(new Cursor<(string | null)[]>(exportFactsQuery(needs), [], { rowMode: 'array' }));
  for await (const rows of cursorBatches(cursor, BATCH)) yield decoded(rows, regionOf);
}

/** Facts rows made one at a time as the consumer asks, so each dies young (less for the garbage collector). */
function* decoded(rows: readonly (string | null)[][], regionOf: ReadonlyMap<number, string>): Generator<FactsRow> {
  for (const r of rows) yield decodeRow(r, regionOf);
}
