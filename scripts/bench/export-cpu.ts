/**
 * Node-side cost of the export's two passes, without HTTP or PostgreSQL in the timing: reads the benchmark
 * database's rows once (as the export does), then times the counting pass (facts, criteria, quasi-identifier
 * counts) and the file pass (facts and CSV lines) over the rows in memory, best of 5. A tool for comparing
 * changes to that code; `npm run bench:export` remains the measure of the whole export.
 *
 *   npx tsx scripts/bench/export-cpu.ts NAME   (NAME: a database kept by `npm run bench:export -- --keep`)
 */
import { openDatabase } from '../../server/db/client';
import { dataRequests, users } from '../../server/db/schema';
import { scopeOf } from '../../server/db/scope';
import { criteriaSteps, firstFailure } from '../../server/services/cohorts/criteria';
import { deriveContext, deriveFacts } from '../../server/services/cohorts/derive';
import { loadReference } from '../../server/services/cohorts/reference';
import { currentRules } from '../../server/services/rules.service';
import { columnsFor } from '../../server/services/exports/columns';
import { countingFacts } from '../../server/services/exports/counting-facts';
import { lineBuilder } from '../../server/services/exports/csv-line';
import { authoriseDownload } from '../../server/services/exports/data-requests.service';
import { scanExportRows } from '../../server/services/exports/export-scan';
import { qiKey } from '../../server/services/exports/generalise';
import { clinicCoder, qiOf } from '../../server/services/exports/row';
import { ensurePostgres } from '../db';
import type { FactsRow } from '../../server/services/cohorts/derive';
import { eq } from 'drizzle-orm';

const name = process.argv[2];
if (!name) throw new Error('usage: export-cpu.ts DATABASE');
const cluster = await ensurePostgres();
const database = openDatabase(cluster.urlFor(name), 2);
const [request] = await database.db.select().from(dataRequests).orderBy(dataRequests.id).limit(1);
const [user] = await database.db.select().from(users).where(eq(users.id, request!.requesterId));
const grant = await authoriseDownload(database.db, scopeOf(user!), request!.id);
const [ref, { rules }] = await Promise.all([loadReference(database.db), currentRules(database.db)]);
const ctx = deriveContext(ref, rules);
const columns = columnsFor(ref, rules, grant);
const steps = criteriaSteps(grant.criteria);

async function read(needs: { scores: boolean; interventions: boolean }): Promise<FactsRow[]> {
  const client = await database.pool.connect();
  try {
    await client.query('begin');
    const rows: FactsRow[] = [];
    for await (const batch of scanExportRows(client, needs)) for (const r of batch) rows.push(r);
    await client.query('rollback');
    return rows;
  } finally {
    client.release();
  }
}
const light = await read({ scores: false, interventions: false });
const full = await read({ scores: true, interventions: true });
await database.pool.end();

function best(label: string, run: () => number): void {
  let min = Infinity;
  let sink = 0;
  for (let r = 0; r < 6; r++) {
    const t = performance.now();
    sink += run();
    if (r > 0) min = Math.min(min, performance.now() - t);
  }
  console.log(`${label}: ${min.toFixed(0)} ms for ${light.length} rows (${sink > 0 ? 'ok' : '-'})`);
}
best('counting pass', () => {
  const index = new Map<string, number>();
  for (const row of light) {
    const f = countingFacts(row, ctx);
    if (firstFailure(steps, f) >= 0) continue;
    const key = qiKey(qiOf(f, grant.startGranularity));
    index.set(key, (index.get(key) ?? 0) + 1);
  }
  return index.size;
});
best('file pass', () => {
  const line = lineBuilder(columns, clinicCoder());
  let bytes = 0;
  let text = '';
  let n = 0;
  for (const row of full) {
    const f = deriveFacts(row, ctx);
    const q = qiOf(f, grant.startGranularity);
    text += `${line(f, q)}\n`;
    if (++n === 512) {
      bytes += Buffer.byteLength(text);
      text = '';
      n = 0;
    }
  }
  return bytes + text.length;
});
