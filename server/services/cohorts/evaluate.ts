import type { CohortCriteria } from '../../../shared/schemas/cohort';
import type { RegistryRules } from '../../../shared/rules';
import type { Db } from '../../db/client';
import { criteriaSteps, firstFailure, needsScores, type CriterionStep } from './criteria';
import { deriveContext, type EpisodeFacts } from './derive';
import type { Reference } from './reference';
import { episodeTotals, scanFacts, withSnapshot } from './scan';
import { cachedByDataVersion } from '../cache';

export type CohortRun = {
  /** Every episode in the registry, and those with research consent. */
  total: number;
  consenting: number;
  steps: CriterionStep[];
  /** Episodes that left at each step (index as `steps`); step 0 (consent) includes the non-consenting ones. */
  excluded: number[];
  count: number;
  clinics: number;
};

/** Runs one cohort on today's data in one snapshot, calling `onIncluded` for each member (for summaries). */
export async function runCohort(
  db: Db,
  ref: Reference,
  rules: RegistryRules,
  criteria: CohortCriteria,
  opts: { scores?: boolean; onIncluded?: (f: EpisodeFacts) => void } = {},
): Promise<CohortRun> {
  const steps = criteriaSteps(criteria);
  const ctx = deriveContext(ref, rules);
  return withSnapshot(db, async (client) => {
    const { total, consenting } = await episodeTotals(client);
    const excluded = steps.map(() => 0);
    excluded[0] = total - consenting;
    const clinics = new Set<number>();
    let count = 0;
    for await (const batch of scanFacts(client, ctx, { scores: opts.scores ?? needsScores(criteria) })) {
      for (const f of batch) {
        const failed = firstFailure(steps, f);
        if (failed >= 0) {
          excluded[failed]!++;
          continue;
        }
        count++;
        clinics.add(f.clinicId);
        opts.onIncluded?.(f);
      }
    }
    return { total, consenting, steps, excluded, count, clinics: clinics.size };
  });
}

/**
 * Counts of many cohorts in a single pass over the registry (the saved-cohorts list), cached until the
 * registry's data (or its rules) next change: opening the list again costs no scan.
 */
export async function countCohorts(
  db: Db,
  ref: Reference,
  rules: RegistryRules,
  criteriaList: readonly CohortCriteria[],
): Promise<{ count: number; clinics: number }[]> {
  if (criteriaList.length === 0) return [];
  const key = `cohort-counts|${JSON.stringify(rules)}|${JSON.stringify(criteriaList)}`;
  return (await cachedByDataVersion(db, key, () => scanCounts(db, ref, rules, criteriaList))).value;
}

async function scanCounts(
  db: Db,
  ref: Reference,
  rules: RegistryRules,
  criteriaList: readonly CohortCriteria[],
): Promise<{ count: number; clinics: number }[]> {
  if (criteriaList.length === 0) return [];
  const all = criteriaList.map((c) => ({ steps: criteriaSteps(c), count: 0, clinics: new Set<number>() }));
  const ctx = deriveContext(ref, rules);
  return withSnapshot(db, async (client) => {
    for await (const batch of scanFacts(client, ctx, { scores: criteriaList.some(needsScores) })) {
      for (const f of batch) {
        for (const c of all) {
          if (firstFailure(c.steps, f) >= 0) continue;
          c.count++;
          c.clinics.add(f.clinicId);
        }
      }
    }
    return all.map((c) => ({ count: c.count, clinics: c.clinics.size }));
  });
}
