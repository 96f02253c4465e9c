import type { Timepoint } from '../../shared/constants';
import { assessmentDateProblem, episodeStateProblems } from './episodes-rules';
import { resolveInterventions, type ResolvedIntervention } from './reference-checks';
import type { ReferenceData } from './reference.service';
import type { StoredAssessment, StoredEpisode } from './uploads-existing';
import type { IssueLog } from './uploads-issues';
import type { Header } from './uploads-parse';
import type { UploadEpisode, UploadEpisodeFields } from './uploads-validate';

export type PlannedEpisode = {
  reference: string;
  fields: UploadEpisodeFields;
  stored: StoredEpisode | undefined;
  changed: string[];
  /** The full new list when the file has the column and it differs from what is stored. */
  interventions: ResolvedIntervention[] | undefined;
};
export type PlannedAssessment = {
  reference: string;
  /** The stored episode's id; undefined for an episode the same upload creates. */
  episodeId: number | undefined;
  stored: StoredAssessment | undefined;
  assessedOn: string;
  timepoint: Timepoint;
  reporter: 'clinician' | 'patient';
  avgDailySteps: number | null;
  adverseEvent: string | null;
  /** Instrument code → total; a null (an empty cell) is skipped when writing. */
  scores: Record<string, number | null>;
  changed: string[];
};
export type Plan = {
  episodes: PlannedEpisode[];
  assessments: PlannedAssessment[];
  rowsUnchanged: number;
  rejectedRows: Set<number>;
};

const OPTIONAL_EPISODE_COLUMNS = [
  ['condition', 'conditionCode'], ['status', 'status'], ['discharge_date', 'dischargeDate'], ['discharge_reason', 'dischargeReason'],
] as const;
const EPISODE_FIELDS = [
  'pseudonym', 'conditionCode', 'side', 'startDate', 'symptomWeeks', 'ageYears', 'sex', 'heightCm', 'weightKg',
  'activityProfile', 'standingWork', 'researchConsent', 'status', 'dischargeDate', 'dischargeReason',
] as const;
const STATE_COLUMN: Record<string, string> = { dischargeDate: 'discharge_date', dischargeReason: 'discharge_reason', status: 'status' };

const interventionKey = (list: { code: string; startWeek: number; maxLevel: number | null }[]) =>
  list.map((i) => `${i.code}@${i.startWeek}:${i.maxLevel ?? ''}`).sort().join(';');

/** Cross-row checks against what is stored, then what a commit would create and update (and what it leaves alone). */
export function planUpload(
  groups: Iterable<UploadEpisode>,
  stored: Map<string, StoredEpisode>,
  ref: ReferenceData,
  header: Header,
  log: IssueLog,
): Plan {
  const plan: Plan = { episodes: [], assessments: [], rowsUnchanged: 0, rejectedRows: new Set() };
  for (const g of groups) {
    const before = log.total;
    const fail = (row: number, column: string | null, message: string) => log.add(row, column, message);
    if (!g.fields) {
      for (const r of g.rows) plan.rejectedRows.add(r.row);
      continue;
    }
    const s = stored.get(g.reference);
    const fields: UploadEpisodeFields = { ...g.fields };
    if (s) {
      if (s.pseudonym !== fields.pseudonym) {
        fail(g.firstRow, 'pseudonym', `Episode “${g.reference}” is stored with a different pseudonym; a reference belongs to one patient, so use a new reference (or correct the episode on its screen)`);
      }
      for (const [col, f] of OPTIONAL_EPISODE_COLUMNS) if (!header.has.has(col)) (fields as Record<string, unknown>)[f] = s[f];
    }
    if (!ref.conditions.has(fields.conditionCode)) fail(g.firstRow, 'condition', `Unknown condition “${fields.conditionCode}”`);
    for (const p of episodeStateProblems(fields)) fail(g.firstRow, STATE_COLUMN[p.field] ?? null, p.message);

    let interventions: ResolvedIntervention[] | undefined;
    if (g.interventions !== undefined) {
      const r = resolveInterventions(g.interventions, ref);
      for (const p of r.problems) fail(g.firstRow, 'interventions', p.message);
      if (!s || interventionKey(s.interventions) !== interventionKey(r.resolved)) interventions = r.resolved;
    }

    // Assessments: one baseline, no repeats, nothing before the baseline.
    const seen = new Map<string, number>();
    let fileBaseline: { row: number; on: string } | undefined;
    for (const r of g.rows) {
      const k = r.timepoint === 'baseline' ? 'baseline' : `${r.timepoint}|${r.assessedOn}`;
      if (seen.has(k)) {
        const what = r.timepoint === 'baseline' ? 'A second baseline' : `The same ${r.timepoint} assessment on ${r.assessedOn}`;
        fail(r.row, 'timepoint', `${what} for episode “${g.reference}” (see row ${seen.get(k)}); an episode has one of each`);
      } else seen.set(k, r.row);
      if (r.timepoint === 'baseline' && !fileBaseline) fileBaseline = { row: r.row, on: r.assessedOn };
    }
    const storedBaseline = s?.assessments.find((a) => a.timepoint === 'baseline');
    if (!s && !fileBaseline) fail(g.firstRow, 'timepoint', `Episode “${g.reference}” is new and has no baseline row; add its baseline assessment`);
    const baselineOn = fileBaseline?.on ?? storedBaseline?.assessedOn ?? null;
    if (!fileBaseline && storedBaseline && storedBaseline.assessedOn < fields.startDate) {
      fail(g.firstRow, 'start_date', `The start date ${fields.startDate} is after the stored baseline (${storedBaseline.assessedOn})`);
    }
    for (const r of g.rows) {
      const p = assessmentDateProblem(r.timepoint, r.assessedOn, fields.startDate, baselineOn);
      if (p) fail(r.row, 'assessed_on', p);
    }
    if (fileBaseline && s) {
      const inFile = new Set(g.rows.map((r) => `${r.timepoint}|${r.assessedOn}`));
      const early = s.assessments.find((a) => a.timepoint !== 'baseline' && a.assessedOn < fileBaseline.on && !inFile.has(`${a.timepoint}|${a.assessedOn}`));
      if (early) fail(fileBaseline.row, 'assessed_on', `The stored ${early.timepoint} assessment (${early.assessedOn}) would come before this baseline`);
    }
    if (log.total > before) {
      for (const r of g.rows) plan.rejectedRows.add(r.row);
      continue;
    }

    const changed = s ? EPISODE_FIELDS.filter((f) => s[f] !== fields[f]) : [];
    if (!s || changed.length > 0 || interventions) plan.episodes.push({ reference: g.reference, fields, stored: s, changed, interventions });
    for (const r of g.rows) {
      const old = r.timepoint === 'baseline' ? storedBaseline : s?.assessments.find((a) => a.timepoint === r.timepoint && a.assessedOn === r.assessedOn);
      const reporter = r.reporter ?? old?.reporter ?? 'clinician';
      const avgDailySteps = r.avgDailySteps !== undefined ? r.avgDailySteps : (old?.avgDailySteps ?? null);
      const adverseEvent = r.adverseEvent !== undefined ? r.adverseEvent : (old?.adverseEvent ?? null);
      const changed: string[] = [];
      if (old) {
        if (old.assessedOn !== r.assessedOn) changed.push('assessedOn');
        if (old.reporter !== reporter) changed.push('reporter');
        if (old.avgDailySteps !== avgDailySteps) changed.push('avgDailySteps');
        if (old.adverseEvent !== adverseEvent) changed.push('adverseEvent');
        for (const code in r.scores) if ((r.scores[code] ?? undefined) !== old.scores[code]) changed.push(`scores.${code}`);
        if (changed.length === 0) {
          plan.rowsUnchanged++;
          continue;
        }
      }
      // The file is the truth for the score columns it has; the others keep what is stored.
      // A new assessment keeps the row's own scores object (no copy for 100,000 rows).
      const scores = old ? { ...old.scores, ...r.scores } : r.scores;
      plan.assessments.push({
        reference: g.reference,
        episodeId: s?.id,
        stored: old,
        assessedOn: r.assessedOn,
        timepoint: r.timepoint,
        reporter,
        avgDailySteps,
        adverseEvent,
        scores,
        changed,
      });
    }
  }
  return plan;
}
