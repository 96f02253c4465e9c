/**
 * The column groups of the research export (see shared/export-columns.ts for the types and the order).
 * Each column says its type, unit, allowed values and how it is derived; the data dictionary prints exactly this.
 */
import type { ColumnContext, ColumnSource, EpisodeField, ExportColumn, InstrumentPart } from './export-columns';

/** A code turned into a column-name part: lower case, letters, digits and underscores. */
export const columnPart = (code: string) =>
  code
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_|_$/g, '');

const field = (f: EpisodeField): ColumnSource => ({ kind: 'field', field: f });

export const SUBGROUP_COLUMNS: ExportColumn[] = [
  {
    name: 'condition_code',
    group: 'subgroups',
    type: 'category',
    unit: '',
    allowed: 'registry condition code',
    derivation: 'Condition of the episode',
    source: field('condition_code'),
    quasiIdentifier: false,
  },
  {
    name: 'side',
    group: 'subgroups',
    type: 'category',
    unit: '',
    allowed: 'left | right | both',
    derivation: 'Side affected',
    source: field('side'),
    quasiIdentifier: false,
  },
  {
    name: 'standing_work',
    group: 'subgroups',
    type: 'flag',
    unit: '',
    allowed: '0 | 1',
    derivation: '1 when the person stands for most of the working day',
    source: field('standing_work'),
    quasiIdentifier: false,
  },
  {
    name: 'symptom_duration_band',
    group: 'subgroups',
    type: 'category',
    unit: '',
    allowed: '<3m | 3-12m | >12m',
    derivation: 'Symptom duration before the start: under 13 weeks, 13–52 weeks, over 52 weeks',
    source: field('symptom_duration_band'),
    quasiIdentifier: false,
  },
];

export const CARE_COLUMNS: ExportColumn[] = [
  {
    name: 'episode_status',
    group: 'care',
    type: 'category',
    unit: '',
    allowed: 'open | discharged | lost',
    derivation: 'Status of the episode on the day of the export',
    source: field('episode_status'),
    quasiIdentifier: false,
  },
  {
    name: 'discharge_reason',
    group: 'care',
    type: 'category',
    unit: '',
    allowed: 'recovered | goals-met | self-discharge | referred-on | lost-to-follow-up, or empty',
    derivation: 'Coded reason for discharge',
    source: field('discharge_reason'),
    quasiIdentifier: false,
  },
  {
    name: 'discharge_day',
    group: 'care',
    type: 'integer',
    unit: 'days',
    allowed: '>= 0, or empty',
    derivation: 'Days from the start date to discharge',
    source: field('discharge_day'),
    quasiIdentifier: false,
  },
  {
    name: 'assessment_count',
    group: 'care',
    type: 'integer',
    unit: 'assessments',
    allowed: '>= 1',
    derivation: 'Number of assessments, baseline included',
    source: field('assessment_count'),
    quasiIdentifier: false,
  },
];

export function instrumentColumns(ctx: ColumnContext, group: 'scores' | 'change'): ExportColumn[] {
  const w = ctx.window;
  const windowText = `the assessment nearest week ${w.targetWeek} within weeks ${w.fromWeek}–${w.toWeek} (registry rule)`;
  return ctx.instruments.flatMap((i): ExportColumn[] => {
    const p = columnPart(i.code);
    const range = `${i.min} to ${i.max}, or empty`;
    const src = (part: InstrumentPart): ColumnSource => ({ kind: 'instrument', code: i.code, part });
    const base = { group, unit: i.unit, quasiIdentifier: false };
    if (group === 'scores') {
      return [
        {
          ...base,
          name: `${p}_baseline`,
          type: 'number',
          allowed: range,
          derivation: `${i.label}: score at the baseline assessment`,
          source: src('baseline'),
        },
        {
          ...base,
          name: `${p}_followup`,
          type: 'number',
          allowed: range,
          derivation: `${i.label}: score at the primary follow-up, ${windowText}`,
          source: src('followup'),
        },
        {
          ...base,
          name: `${p}_followup_day`,
          type: 'integer',
          unit: 'days',
          allowed: '>= 0, or empty',
          derivation: `Days from the start date to the primary follow-up of ${i.code}`,
          source: src('followup_day'),
        },
      ];
    }
    const sign = i.higherIsBetter ? 'follow-up − baseline' : 'baseline − follow-up';
    return [
      {
        ...base,
        name: `${p}_change`,
        type: 'number',
        allowed: 'number (positive = better), or empty',
        derivation: `${i.label}: ${sign}, so a positive change means improvement`,
        source: src('change'),
      },
      {
        ...base,
        name: `${p}_responder`,
        type: 'flag',
        unit: '',
        allowed: '0 | 1, or empty',
        derivation:
          i.mcid === null
            ? `${i.code} has no MCID: always empty`
            : `1 when the change is at least the MCID of ${i.mcid} ${i.unit}; empty without baseline or primary follow-up`,
        source: src('responder'),
      },
    ];
  });
}

export function recoveryColumns(ctx: ColumnContext): ExportColumn[] {
  const r = ctx.recovery;
  return [
    {
      name: 'recovery_event',
      group: 'recovery',
      type: 'flag',
      unit: '',
      allowed: '0 | 1',
      derivation: `1 when an assessment after the start met the recovery rule (${r.instrumentCode} at or past ${r.threshold}); 0 = censored`,
      source: field('recovery_event'),
      quasiIdentifier: false,
    },
    {
      name: 'recovery_weeks',
      group: 'recovery',
      type: 'number',
      unit: 'weeks',
      allowed: '>= 0, 2 decimals, or empty',
      derivation:
        'Weeks from the start to the first assessment meeting the rule, or to the last assessment when censored',
      source: field('recovery_weeks'),
      quasiIdentifier: false,
    },
  ];
}

export function interventionColumns(ctx: ColumnContext): ExportColumn[] {
  return ctx.interventions.map((c) => ({
    name: `int_${columnPart(c.code)}`,
    group: 'interventions' as const,
    type: 'flag' as const,
    unit: '',
    allowed: '0 | 1',
    derivation: `1 when the episode received "${c.label}" (${c.code})`,
    source: { kind: 'intervention' as const, code: c.code },
    quasiIdentifier: false,
  }));
}
