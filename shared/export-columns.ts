/**
 * The one definition of the de-identified research export: every column's name, type, unit, allowed values and
 * how it is derived. The CSV writer (server) and the data dictionary (CSV or Markdown) are both generated from it,
 * so the file and its documentation cannot drift apart.
 */
import {
  CARE_COLUMNS,
  instrumentColumns,
  interventionColumns,
  recoveryColumns,
  SUBGROUP_COLUMNS,
} from './export-column-groups';

export { columnPart } from './export-column-groups';

/** `core` (ids, period and the quasi-identifiers) is in every export; the others are asked for. */
export const REQUESTABLE_GROUPS = ['subgroups', 'scores', 'change', 'recovery', 'interventions', 'care'] as const;
export const VARIABLE_GROUPS = ['core', ...REQUESTABLE_GROUPS] as const;
export type VariableGroup = (typeof VARIABLE_GROUPS)[number];

export const GROUP_LABELS: Record<VariableGroup, string> = {
  core: 'Study id, site code, region, start period, age band, sex, BMI band, activity profile (always included)',
  subgroups: 'Condition, side, standing work, symptom-duration band',
  scores: 'Baseline and primary follow-up score of every instrument, with the follow-up day',
  change: 'Change scores and responder flags',
  recovery: 'Recovery event and weeks to recovery or censoring',
  interventions: 'Interventions received, one 0/1 column each',
  care: 'Episode status, discharge reason and day, number of assessments',
};

export const DATA_REQUEST_STATUSES = ['pending', 'approved', 'declined'] as const;
export type DataRequestStatus = (typeof DATA_REQUEST_STATUSES)[number];
export const EXPORT_STATUSES = ['completed', 'aborted', 'failed'] as const;
export type ExportStatus = (typeof EXPORT_STATUSES)[number];
export const START_GRANULARITIES = ['year', 'quarter'] as const;
export type StartGranularity = (typeof START_GRANULARITIES)[number];

/** Text and category cells are text in the file (and are neutralised against formula injection); the rest are numbers. */
export type ColumnType = 'text' | 'category' | 'integer' | 'number' | 'flag';

export const EPISODE_FIELDS = [
  'study_id',
  'clinic_code',
  'clinic_region',
  'start_period',
  'age_band',
  'sex',
  'bmi_band',
  'activity_profile',
  'bmi',
  'condition_code',
  'side',
  'standing_work',
  'symptom_duration_band',
  'recovery_event',
  'recovery_weeks',
  'episode_status',
  'discharge_reason',
  'discharge_day',
  'assessment_count',
] as const;
export type EpisodeField = (typeof EPISODE_FIELDS)[number];
export const INSTRUMENT_PARTS = ['baseline', 'followup', 'followup_day', 'change', 'responder'] as const;
export type InstrumentPart = (typeof INSTRUMENT_PARTS)[number];

export type ColumnSource =
  | { kind: 'field'; field: EpisodeField }
  | { kind: 'instrument'; code: string; part: InstrumentPart }
  | { kind: 'intervention'; code: string };

export type ExportColumn = {
  name: string;
  group: VariableGroup;
  type: ColumnType;
  unit: string;
  allowed: string;
  derivation: string;
  source: ColumnSource;
  /** Part of the k-anonymity check (may be generalised). */
  quasiIdentifier: boolean;
};

export type ColumnContext = {
  instruments: readonly {
    code: string;
    label: string;
    unit: string;
    min: number;
    max: number;
    higherIsBetter: boolean;
    mcid: number | null;
  }[];
  interventions: readonly { code: string; label: string }[];
  window: { fromWeek: number; toWeek: number; targetWeek: number };
  recovery: { instrumentCode: string; threshold: number };
  startGranularity: StartGranularity;
  allowRawBmi: boolean;
  k: number;
};

/** The quasi-identifiers of the k-anonymity check, in the order of the generalisation key. */
export const QUASI_IDENTIFIERS = [
  'age_band',
  'sex',
  'bmi_band',
  'activity_profile',
  'start_period',
  'clinic_region',
] as const;
export type QuasiIdentifier = (typeof QUASI_IDENTIFIERS)[number];

const field = (f: EpisodeField): ColumnSource => ({ kind: 'field', field: f });

function coreColumns(ctx: ColumnContext): ExportColumn[] {
  const kNote = `generalised where fewer than k = ${ctx.k} rows share the quasi-identifiers`;
  const cols: ExportColumn[] = [
    {
      name: 'study_id',
      group: 'core',
      type: 'text',
      unit: '',
      allowed: 'random UUID',
      derivation: 'A new random id for every row of every export; two exports cannot be joined on it',
      source: field('study_id'),
      quasiIdentifier: false,
    },
    {
      name: 'clinic_code',
      group: 'core',
      type: 'text',
      unit: '',
      allowed: "'S' + 6 hex digits",
      derivation: 'A random code per clinic, drawn anew for every export',
      source: field('clinic_code'),
      quasiIdentifier: false,
    },
    {
      name: 'clinic_region',
      group: 'core',
      type: 'text',
      unit: '',
      allowed: "region name, or '*'",
      derivation: `Region of the clinic; '*' when ${kNote}`,
      source: field('clinic_region'),
      quasiIdentifier: true,
    },
    {
      name: 'start_period',
      group: 'core',
      type: 'category',
      unit: '',
      allowed: ctx.startGranularity === 'quarter' ? "'YYYY-Qn', or 'YYYY' when generalised" : "'YYYY'",
      derivation: `Start date of the episode reduced to the ${ctx.startGranularity}; no calendar date is exported`,
      source: field('start_period'),
      quasiIdentifier: true,
    },
    {
      name: 'age_band',
      group: 'core',
      type: 'category',
      unit: 'years',
      allowed: "'15-19' … '85-89', '90+'; or 10-year ('40-49') or 20-year ('40-59', '80+') bands",
      derivation: `Age at the start in 5-year bands, 90 and over top-coded; widened when ${kNote}`,
      source: field('age_band'),
      quasiIdentifier: true,
    },
    {
      name: 'sex',
      group: 'core',
      type: 'category',
      unit: '',
      allowed: 'female | male | other',
      derivation: 'As recorded by the clinic',
      source: field('sex'),
      quasiIdentifier: true,
    },
    {
      name: 'bmi_band',
      group: 'core',
      type: 'category',
      unit: '',
      allowed: "underweight | healthy | overweight | obese, or '*'",
      derivation: `WHO adult band of weight/height² (WHO TRS 894, 2000); '*' when ${kNote}. Height and weight are never exported`,
      source: field('bmi_band'),
      quasiIdentifier: true,
    },
    {
      name: 'activity_profile',
      group: 'core',
      type: 'category',
      unit: '',
      allowed: 'runner | active | sedentary',
      derivation: 'Activity profile recorded at the start',
      source: field('activity_profile'),
      quasiIdentifier: true,
    },
  ];
  if (ctx.allowRawBmi) {
    cols.push({
      name: 'bmi',
      group: 'core',
      type: 'number',
      unit: 'kg/m²',
      allowed: '1 decimal',
      derivation:
        'weight (kg) / height (m)², rounded to 0.1; allowed by the steward for this request; empty where the BMI band is generalised',
      source: field('bmi'),
      quasiIdentifier: false,
    });
  }
  return cols;
}

/** The columns of an export of the given groups, in file order (`core` always first). */
export function exportColumns(groups: readonly VariableGroup[], ctx: ColumnContext): ExportColumn[] {
  const want = new Set<VariableGroup>(['core', ...groups]);
  const parts: Record<VariableGroup, () => ExportColumn[]> = {
    core: () => coreColumns(ctx),
    subgroups: () => SUBGROUP_COLUMNS,
    scores: () => instrumentColumns(ctx, 'scores'),
    change: () => instrumentColumns(ctx, 'change'),
    recovery: () => recoveryColumns(ctx),
    interventions: () => interventionColumns(ctx),
    care: () => CARE_COLUMNS,
  };
  return VARIABLE_GROUPS.filter((g) => want.has(g)).flatMap((g) => parts[g]());
}
