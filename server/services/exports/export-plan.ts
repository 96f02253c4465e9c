import type pg from 'pg';
import type { StartGranularity } from '../../../shared/export-columns';
import { firstFailure, type CriterionStep } from '../cohorts/criteria';
import { deriveFacts, type DeriveContext } from '../cohorts/derive';
import { countingFacts } from './counting-facts';
import { scanExportRows, type ScanNeeds } from './export-scan';
import { generalise, planGeneralisation, qiKey, type Plan, type Qi } from './generalise';
import { qiOf } from './row';

/** A growable list of 32-bit integers: four bytes per episode, however large the registry. */
class IntList {
  private data = new Int32Array(1024);
  length = 0;
  push(v: number): void {
    if (this.length === this.data.length) {
      const bigger = new Int32Array(this.data.length * 2);
      bigger.set(this.data);
      this.data = bigger;
    }
    this.data[this.length++] = v;
  }
  at(i: number): number | undefined {
    return i < this.length ? this.data[i] : undefined;
  }
}

/**
 * The counting pass's verdict on every consenting episode, in scan order: its id (to check that the file pass
 * walks the same rows) and the exported quasi-identifiers of its combination, or null when it is outside the
 * cohort or suppressed. The file pass follows it row by row instead of deciding again, so the file holds
 * exactly the rows that were counted, at the level planned for them: k-anonymity holds by construction.
 */
export type CohortVerdict = { plan: Plan; ids: IntList; combination: IntList; exported: (Qi | null)[] };

/** Pass 1: cohort membership and quasi-identifier combination of every episode, then the generalisation plan. */
export async function countCohort(
  client: pg.PoolClient,
  ctx: DeriveContext,
  opts: { steps: readonly CriterionStep[]; granularity: StartGranularity; needs: ScanNeeds; k: number },
): Promise<CohortVerdict> {
  const index = new Map<string, number>();
  const entries: { key: string; qi: Qi; n: number }[] = [];
  const ids = new IntList();
  const combination = new IntList();
  // Score facts only when a criterion reads them (the scan brings scores exactly then).
  const facts = opts.needs.scores ? deriveFacts : countingFacts;
  for await (const rows of scanExportRows(client, opts.needs)) {
    for (const row of rows) {
      const f = facts(row, ctx);
      ids.push(f.id);
      if (firstFailure(opts.steps, f) >= 0) {
        combination.push(-1);
        continue;
      }
      const qi = qiOf(f, opts.granularity);
      const key = qiKey(qi);
      let c = index.get(key);
      if (c === undefined) {
        c = entries.length;
        index.set(key, c);
        entries.push({ key, qi, n: 0 });
      }
      entries[c]!.n++;
      combination.push(c);
    }
  }
  const plan = planGeneralisation(new Map(entries.map((e) => [e.key, e])), opts.k);
  const exported = entries.map(({ key, qi }) => {
    const level = plan.decision.get(key);
    return level === undefined || level === 'suppress' ? null : generalise(qi, level);
  });
  return { plan, ids, combination, exported };
}

/** The exported quasi-identifiers of the `ordinal`-th row of the file pass, or null when it is left out. */
export function verdictOf(v: CohortVerdict, ordinal: number, episodeId: number): Qi | null {
  if (v.ids.at(ordinal) !== episodeId) {
    throw new Error('export: the file pass did not see the episodes the count saw; nothing more is sent');
  }
  const c = v.combination.at(ordinal)!;
  return c < 0 ? null : v.exported[c]!;
}
