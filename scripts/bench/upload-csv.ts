import { createHmac } from 'node:crypto';
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { stringify } from 'csv-stringify/sync';
import { UPLOAD_COLUMNS } from '../../shared/upload-columns';
import { DEMO_CLINIC_SPECS, generateDemoEpisodes } from '../seed/episodes';

const SCORE_COLUMN = new Map(UPLOAD_COLUMNS.filter((c) => c.level === 'score').map((c) => [c.field, c.name]));

/**
 * A realistic upload of exactly `rows` assessment rows: the demo generator's invented episodes of one clinic,
 * one row per assessment with the episode columns repeated. Pseudonyms are HMAC-SHA-256 with a fixed bench key.
 */
export function demoUploadCsv(rows: number, seed: number, today: string): string {
  const episodes = generateDemoEpisodes({ episodes: Math.ceil(rows / 2.2), seed, today, clinics: [{ ...DEMO_CLINIC_SPECS[0]!, weight: 1 }] });
  const out: string[][] = [UPLOAD_COLUMNS.map((c) => c.name)];
  for (const e of episodes) {
    const p = e.patient;
    const epi: Record<string, string> = {
      episode_reference: e.reference,
      pseudonym: createHmac('sha256', 'loadline-bench').update(e.localId).digest('hex'),
      side: p.side,
      start_date: e.startDate,
      symptom_weeks: String(p.symptomWeeks),
      age_years: String(p.ageYears),
      sex: p.sex,
      height_cm: String(p.heightCm),
      weight_kg: String(p.weightKg),
      activity_profile: p.activityProfile,
      standing_work: p.standingWork ? 'yes' : 'no',
      research_consent: e.researchConsent ? 'yes' : 'no',
      status: e.status,
      discharge_date: e.dischargeDate ?? '',
      discharge_reason: e.dischargeReason ?? '',
      interventions: e.interventions.map((i) => `${i.code}${i.startWeek ? `@${i.startWeek}` : ''}${i.maxLevel ? `:${i.maxLevel}` : ''}`).join(';'),
    };
    for (const a of e.assessments) {
      if (out.length > rows) break;
      const cells: Record<string, string> = {
        ...epi,
        assessed_on: a.assessedOn,
        timepoint: a.timepoint,
        reporter: a.reporter,
        avg_daily_steps: a.avgDailySteps === null ? '' : String(a.avgDailySteps),
        adverse_event: a.adverseEvent ?? '',
      };
      for (const [code, v] of Object.entries(a.scores)) cells[SCORE_COLUMN.get(code)!] = String(v);
      out.push(UPLOAD_COLUMNS.map((c) => cells[c.name] ?? ''));
    }
    if (out.length > rows) break;
  }
  if (out.length <= rows) throw new Error(`generated only ${out.length - 1} rows`);
  return stringify(out);
}

// `tsx scripts/bench/upload-csv.ts <rows> <seed> <today> <out.csv.gz>`: the bench makes its file in a child
// process, so the bench's own peak memory is the upload's, not the generator's.
if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const [rows, seed, today, out] = process.argv.slice(2);
  writeFileSync(out!, gzipSync(demoUploadCsv(Number(rows), Number(seed), today!)));
}
