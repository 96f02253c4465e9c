/** How each setting of the registry rules reads on screen (paths as in shared/rules.ts). */
export const RULE_LABELS: Record<string, string> = {
  'recovery.instrumentCode': 'Recovery instrument',
  'recovery.threshold': 'Recovery threshold',
  'primaryWindow.fromWeek': 'Primary follow-up window, first week',
  'primaryWindow.targetWeek': 'Primary follow-up, target week',
  'primaryWindow.toWeek': 'Primary follow-up window, last week',
  'followUpWindows.week6.fromDay': 'Week-6 follow-up, first day',
  'followUpWindows.week6.toDay': 'Week-6 follow-up, last day',
  'followUpWindows.week12.fromDay': 'Week-12 follow-up, first day',
  'followUpWindows.week12.toDay': 'Week-12 follow-up, last day',
  'followUpWindows.week26.fromDay': 'Week-26 follow-up, first day',
  'followUpWindows.week26.toDay': 'Week-26 follow-up, last day',
  'targets.recoveredByWeek12': 'Expected share recovered by week 12',
  'targets.respondersAtWeek12': 'Expected share of responders at week 12',
  minCellEstimate: 'Smallest group with an estimate',
  minCellResearcher: 'Smallest count shown to researchers',
  exportK: 'Export k (k-anonymity)',
  completenessTarget: 'Follow-up completeness target',
};

const SHARES = new Set(['targets.recoveredByWeek12', 'targets.respondersAtWeek12', 'completenessTarget']);

/** A setting's value in words: shares as percentages, the rest as given. */
export function ruleValue(path: string, value: unknown): string {
  if (typeof value === 'number' && SHARES.has(path)) return `${Math.round(value * 1000) / 10}%`;
  if (value === null || value === undefined) return '—';
  return String(value);
}

export const ruleLabel = (path: string) => RULE_LABELS[path] ?? path;
