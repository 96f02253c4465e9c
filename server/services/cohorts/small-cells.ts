import type { CountCell } from '../../../shared/schemas/cohort';
import type { Scope } from '../../db/scope';
import type { RegistryRules } from '../../../shared/rules';

/**
 * Small-cell suppression for aggregates shown to researchers: a count from 1 to k−1 is shown as "<k"
 * (0 stays 0, as public suppression rules allow). The steward sees exact counts.
 */
export type Suppress = { k: number | null; cell(n: number): CountCell; small(n: number): boolean };

export function suppressionFor(scope: Scope, rules: RegistryRules): Suppress {
  const k = scope.kind === 'registry' && scope.researcher ? rules.minCellResearcher : null;
  const small = (n: number) => k !== null && n > 0 && n < k;
  return { k, small, cell: (n) => (small(n) ? `<${k}` : n) };
}

/** The difference of two counts, unless either is hidden (it would give the hidden one away). */
export function countChange(s: Suppress, before: number, now: number): number | null {
  return s.small(before) || s.small(now) ? null : now - before;
}
