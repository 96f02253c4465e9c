import {
  exportColumns,
  type ColumnContext,
  type ExportColumn,
  type VariableGroup,
} from '../../../shared/export-columns';
import type { RegistryRules } from '../../../shared/rules';
import type { Reference } from '../cohorts/reference';
import type { DownloadGrant } from './data-requests.service';

/** The column context of one request: the registry's instruments and accepted intervention codes, today's rules. */
export function columnContext(
  ref: Reference,
  rules: RegistryRules,
  grant: Pick<DownloadGrant, 'startGranularity' | 'allowRawBmi' | 'k'>,
): ColumnContext {
  return {
    instruments: ref.instruments.filter((i) => !i.retired),
    interventions: ref.interventions.filter((i) => i.accepted),
    window: rules.primaryWindow,
    recovery: rules.recovery,
    startGranularity: grant.startGranularity,
    allowRawBmi: grant.allowRawBmi,
    k: grant.k,
  };
}

export function columnsFor(ref: Reference, rules: RegistryRules, grant: DownloadGrant): ExportColumn[] {
  return exportColumns(grant.variableGroups, columnContext(ref, rules, grant));
}

/** Groups whose columns are computed from the scores (the costly part of the facts query). */
export const groupsNeedScores = (groups: readonly VariableGroup[]) =>
  groups.some((g) => g === 'scores' || g === 'change' || g === 'recovery' || g === 'care');
