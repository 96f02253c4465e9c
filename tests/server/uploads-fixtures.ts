import { createHash } from 'node:crypto';
import { UPLOAD_COLUMNS } from '../../shared/upload-columns';

export const HEADER = UPLOAD_COLUMNS.map((c) => c.name);
type Row = Record<string, string>;

const pseudonym = (s: string) => createHash('sha256').update(s).digest('hex');
const day = (iso: string, plus: number) => new Date(Date.parse(`${iso}T00:00:00Z`) + plus * 86_400_000).toISOString().slice(0, 10);

/** The rows of one invented episode: a baseline and `followUps` of week 6, 12, 26 (in that order). */
export function episodeRows(ref: string, followUps = 2, over: Row = {}): Row[] {
  const start = '2025-06-02';
  const epi: Row = {
    episode_reference: ref,
    pseudonym: pseudonym(ref),
    condition: '',
    side: 'left',
    start_date: start,
    symptom_weeks: '16',
    age_years: '51',
    sex: 'male',
    height_cm: '176',
    weight_kg: '82.5',
    activity_profile: 'sedentary',
    standing_work: 'yes',
    research_consent: 'yes',
    status: 'open',
    discharge_date: '',
    discharge_reason: '',
    interventions: 'education-load;fascia-stretch;heel-raises:2',
  };
  const visits = [
    { timepoint: 'baseline', d: 0, pain: '7', groc: '' },
    { timepoint: 'week6', d: 42, pain: '5', groc: '2' },
    { timepoint: 'week12', d: 84, pain: '2', groc: '-1' },
    { timepoint: 'week26', d: 182, pain: '1', groc: '5' },
  ].slice(0, followUps + 1);
  return visits.map((v) => ({
    ...epi,
    assessed_on: day(start, v.d),
    timepoint: v.timepoint,
    reporter: 'clinician',
    avg_daily_steps: '6100',
    adverse_event: '',
    score_nprs_first_step: v.pain,
    score_nprs_usual: String(Math.max(0, Number(v.pain) - 1)),
    score_faam_adl: String(100 - 6 * Number(v.pain)),
    score_lefs: '',
    score_psfs: '',
    score_groc: v.groc,
    ...over,
  }));
}

const quote = (v: string) => (/[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);

/** A CSV text with `header` (default: every column) and these rows. */
export function csv(rows: Row[], header: string[] = HEADER, sep = ','): string {
  const lines = [header.join(sep)];
  for (const r of rows) lines.push(header.map((h) => quote(r[h] ?? '')).join(sep));
  return `${lines.join('\r\n')}\r\n`;
}

/**
 * `rows` data rows in the column order of HEADER: episodes of three assessments each (the last may be
 * shorter). Built as plain strings: this runs for 100,000 rows. `tweak(e)` may change episode e's weight.
 */
export function bulkCsv(rows: number, prefix: string, weightOf: (e: number) => string = () => '82.5'): string {
  const visits = [
    ['2025-06-02', 'baseline', '7', '6', '58', ''],
    ['2025-07-14', 'week6', '5', '4', '70', '2'],
    ['2025-08-25', 'week12', '2', '1', '88', '-1'],
  ];
  const out: string[] = [HEADER.join(',')];
  let i = 0;
  for (let e = 0; i < rows; e++) {
    const ref = `${prefix}${e}`;
    const epi = `${ref},${pseudonym(ref)},,left,2025-06-02,16,51,male,176,${weightOf(e)},sedentary,yes,yes,open,,,education-load;fascia-stretch;heel-raises:2`;
    for (let v = 0; v < 3 && i < rows; v++, i++) {
      const [on, tp, fs, us, faam, groc] = visits[v]!;
      out.push(`${epi},${on},${tp},clinician,6100,,${fs},${us},${faam},,,${groc}`);
    }
  }
  return `${out.join('\n')}\n`;
}
