import { ACTIVITY_PROFILES, DISCHARGE_REASONS, EPISODE_STATUSES, REPORTERS, SEXES, SIDES, TIMEPOINTS } from './constants';

/**
 * The columns of the episode CSV upload, defined once. The server's parser and validator, the template
 * (`GET /api/uploads/template.csv`) and the README's column table are all generated from this list.
 * One row per assessment; the episode columns repeat on every row of the same episode and must agree.
 */
export type UploadColumnType = 'text' | 'pseudonym' | 'date' | 'integer' | 'number' | 'enum' | 'boolean' | 'interventions';

export type UploadColumn = {
  name: string;
  type: UploadColumnType;
  /** Required columns must be in the header; a required cell must not be empty. */
  required: boolean;
  /** Episode columns repeat on each row of the episode; assessment columns belong to the row. */
  level: 'episode' | 'assessment' | 'score';
  /** The field of the shared schema the cell fills (for scores: the instrument code). */
  field: string;
  values?: readonly string[];
  description: string;
  /** The two rows of the template: a baseline and a follow-up of one invented episode. */
  example: readonly [string, string];
};

const same = (v: string) => [v, v] as const;
const PSEUDONYM_EXAMPLE = '3f2a9c1e7b4d6f80a5c3e1f9b7d5a3c1e9f7b5d3a1c9e7f5b3d1a9c7e5f3b1d9';

export const UPLOAD_COLUMNS: readonly UploadColumn[] = [
  { name: 'episode_reference', type: 'text', required: true, level: 'episode', field: 'reference', description: 'The clinic’s own episode code (letters, digits, - _ . /; never a name, phone number, e-mail or date)', example: same('HB-E0153') },
  { name: 'pseudonym', type: 'pseudonym', required: true, level: 'episode', field: 'pseudonym', description: 'The patient’s pseudonym: 64 hexadecimal characters made at the clinic (scripts/pseudonym.ts or the episode form)', example: same(PSEUDONYM_EXAMPLE) },
  { name: 'condition', type: 'text', required: false, level: 'episode', field: 'conditionCode', description: 'Condition code; empty means plantar-heel-pain', example: same('plantar-heel-pain') },
  { name: 'side', type: 'enum', required: true, level: 'episode', field: 'side', values: SIDES, description: 'Affected side', example: same('right') },
  { name: 'start_date', type: 'date', required: true, level: 'episode', field: 'startDate', description: 'First day of the episode of care (YYYY-MM-DD)', example: same('2026-01-12') },
  { name: 'symptom_weeks', type: 'integer', required: true, level: 'episode', field: 'symptomWeeks', description: 'Weeks of symptoms before the start (0–1040)', example: same('14') },
  { name: 'age_years', type: 'integer', required: true, level: 'episode', field: 'ageYears', description: 'Age in whole years at the start (16–110)', example: same('47') },
  { name: 'sex', type: 'enum', required: true, level: 'episode', field: 'sex', values: SEXES, description: 'Sex', example: same('female') },
  { name: 'height_cm', type: 'number', required: true, level: 'episode', field: 'heightCm', description: 'Height in centimetres (100–230); BMI is computed by the registry', example: same('168') },
  { name: 'weight_kg', type: 'number', required: true, level: 'episode', field: 'weightKg', description: 'Weight in kilograms (30–300)', example: same('74.5') },
  { name: 'activity_profile', type: 'enum', required: true, level: 'episode', field: 'activityProfile', values: ACTIVITY_PROFILES, description: 'Activity group', example: same('active') },
  { name: 'standing_work', type: 'boolean', required: true, level: 'episode', field: 'standingWork', description: 'Stands for most of the working day (yes or no)', example: same('yes') },
  { name: 'research_consent', type: 'boolean', required: true, level: 'episode', field: 'researchConsent', description: 'Consented to research use (yes or no)', example: same('yes') },
  { name: 'status', type: 'enum', required: false, level: 'episode', field: 'status', values: EPISODE_STATUSES, description: 'Episode status; empty means open', example: same('open') },
  { name: 'discharge_date', type: 'date', required: false, level: 'episode', field: 'dischargeDate', description: 'Date of discharge (YYYY-MM-DD), when discharged', example: same('') },
  { name: 'discharge_reason', type: 'enum', required: false, level: 'episode', field: 'dischargeReason', values: DISCHARGE_REASONS, description: 'Why the episode ended, when discharged or lost', example: same('') },
  { name: 'interventions', type: 'interventions', required: false, level: 'episode', field: 'interventions', description: 'Intervention codes separated by ";", each as code, code:level (graded codes, 1–3) or code@week:level (from week)', example: same('education-load;fascia-stretch;heel-raises:2;toe-flexor@4') },
  { name: 'assessed_on', type: 'date', required: true, level: 'assessment', field: 'assessedOn', description: 'Date of the assessment (YYYY-MM-DD); follow-ups never before the baseline', example: ['2026-01-12', '2026-02-23'] },
  { name: 'timepoint', type: 'enum', required: true, level: 'assessment', field: 'timepoint', values: TIMEPOINTS, description: 'Which assessment this is; exactly one baseline per episode', example: ['baseline', 'week6'] },
  { name: 'reporter', type: 'enum', required: false, level: 'assessment', field: 'reporter', values: REPORTERS, description: 'Who reported the scores; empty means clinician', example: ['clinician', 'patient'] },
  { name: 'avg_daily_steps', type: 'integer', required: false, level: 'assessment', field: 'avgDailySteps', description: 'Average daily steps (0–100000), if measured', example: ['5200', '6900'] },
  { name: 'adverse_event', type: 'text', required: false, level: 'assessment', field: 'adverseEvent', description: 'Coded adverse event (lower-case letters, digits, hyphens), if any', example: ['', ''] },
  { name: 'score_nprs_first_step', type: 'number', required: false, level: 'score', field: 'nprs-first-step', description: 'Pain on first steps in the morning, 0–10 (lower is better)', example: ['7', '4'] },
  { name: 'score_nprs_usual', type: 'number', required: false, level: 'score', field: 'nprs-usual', description: 'Usual pain, 0–10 (lower is better)', example: ['5', '3'] },
  { name: 'score_faam_adl', type: 'number', required: false, level: 'score', field: 'faam-adl', description: 'Foot and ankle function in daily living, 0–100 (higher is better)', example: ['58', '71'] },
  { name: 'score_lefs', type: 'number', required: false, level: 'score', field: 'lefs', description: 'Lower-extremity function, 0–80 (higher is better)', example: ['', ''] },
  { name: 'score_psfs', type: 'number', required: false, level: 'score', field: 'psfs', description: 'Patient-specific function, mean rating 0–10 (higher is better); numbers only, never the activities', example: ['', ''] },
  { name: 'score_groc', type: 'number', required: false, level: 'score', field: 'groc', description: 'Global rating of change, −7 to +7, at follow-ups (negative numbers are fine)', example: ['', '3'] },
];

export const UPLOAD_MAX_BYTES = 10 * 1024 * 1024;
export const UPLOAD_MAX_ROWS = 100_000;
/** A gzip-compressed file may unpack to this much (a plain 100,000-row file is about 20 MB, over the upload limit). */
export const UPLOAD_MAX_UNPACKED_BYTES = 64 * 1024 * 1024;

/** The markdown table of the README section "CSV upload columns" (kept in sync by a test). */
export function uploadColumnsMarkdown(): string {
  const cell = (s: string) => s.replace(/\|/g, '\\|');
  const lines = ['| Column | Type | Required | Meaning | Example |', '| --- | --- | --- | --- | --- |'];
  for (const c of UPLOAD_COLUMNS) {
    const type = c.values ? `one of ${c.values.join(', ')}` : c.type;
    const example = c.example.find((e) => e !== '') ?? '';
    lines.push(`| \`${c.name}\` | ${cell(type)} | ${c.required ? 'yes' : 'no'} | ${cell(c.description)} | ${example ? `\`${cell(example)}\`` : ''} |`);
  }
  return lines.join('\n');
}
