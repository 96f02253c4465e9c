import type { CohortCriteria, CohortPreview } from '../../../shared/schemas/cohort';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { currentRules } from '../rules.service';
import { cachedByDataVersion } from '../cache';
import type { RegistryRules } from '../../../shared/rules';
import { assertRegistry } from './access';
import { runCohort } from './evaluate';
import { assertKnownCodes, loadReference, type Reference } from './reference';
import { suppressionFor, type Suppress } from './small-cells';
import { attritionCells } from './attrition-cells';
import { summaryAccumulator } from './summary';

/** Live preview of a cohort: count, clinics, the flow diagram and the outcome summary, small cells hidden for researchers. */
export async function previewCohort(db: Db, scope: Scope, criteria: CohortCriteria): Promise<CohortPreview> {
  assertRegistry(scope);
  const [ref, { version, rules }] = await Promise.all([loadReference(db), currentRules(db)]);
  assertKnownCodes(ref, criteria);
  const s = suppressionFor(scope, rules);
  // Cached until the registry's data or rules change; researchers and the steward get their own entries.
  const key = `cohort-preview|${version}|${s.k ?? 'exact'}|${JSON.stringify(criteria)}`;
  return (await cachedByDataVersion(db, key, () => compute(db, ref, rules, version, criteria, s))).value;
}

async function compute(
  db: Db,
  ref: Reference,
  rules: RegistryRules,
  version: number,
  criteria: CohortCriteria,
  s: Suppress,
): Promise<CohortPreview> {
  const acc = summaryAccumulator(ref);
  const run = await runCohort(db, ref, rules, criteria, { scores: true, onIncluded: (f) => acc.add(f) });
  const cells = attritionCells(run.total, run.excluded, s);
  const attrition = [
    { step: 'registry', label: 'Episodes in the registry', excluded: 0, remaining: cells.remaining[0] ?? 0 },
    ...run.steps.map((step, i) => ({
      step: step.key,
      label: step.label,
      excluded: cells.excluded[i] ?? 0,
      remaining: cells.remaining[i + 1] ?? 0,
    })),
  ];
  return {
    count: cells.remaining[run.steps.length] ?? s.cell(run.count),
    clinics: run.clinics,
    attrition,
    summary: acc.finish(rules, s),
    suppressedBelow: s.k,
    rulesVersion: version,
  };
}
