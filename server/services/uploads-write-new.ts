import type pg from 'pg';
import type { ReferenceData } from './reference.service';
import { copyIn, copyValue as v, CopyText } from './uploads-copy';
import type { IdPool } from './uploads-ids';
import type { PlannedAssessment, PlannedEpisode } from './uploads-plan';

/** The score rows of some assessments as three parallel arrays; `key` is each assessment's position (1-based) or id. */
export function scoreArrays(list: { scores: Record<string, number | null> }[], key: (index: number) => number, ref: ReferenceData) {
  const of: number[] = [];
  const instrument: number[] = [];
  const value: number[] = [];
  list.forEach((a, k) => {
    for (const code in a.scores) {
      const v = a.scores[code];
      if (v === null || v === undefined) continue;
      of.push(key(k));
      instrument.push(ref.instruments.get(code)!.id);
      value.push(v);
    }
  });
  return { of, instrument, value };
}

const EPISODE = [
  'id', 'clinic_id', 'created_by', 'updated_by', 'pseudonym', 'reference', 'condition_code', 'side', 'start_date', 'symptom_weeks',
  'age_years', 'sex', 'height_cm', 'weight_kg', 'activity_profile', 'standing_work', 'research_consent', 'status', 'discharge_date',
  'discharge_reason',
] as const;
const ASSESSMENT = ['id', 'episode_id', 'assessed_on', 'timepoint', 'reporter', 'avg_daily_steps', 'adverse_event', 'created_by'] as const;

export type NewRows = { episodes: Buffer[]; interventions: Buffer[]; assessments: Buffer[]; scores: Buffer[] };

/**
 * A chunk's new rows as COPY text: its new episodes, their interventions, the new assessments (of new and of
 * stored episodes) and their scores. COPY is the cheapest way into PostgreSQL (no statement text, no array
 * parameters to unpack). Ids come from `ids` (reserved ahead), so children name their parents directly and the
 * text can be made while the previous chunk is still being written.
 */
export function newRowsText(clinicId: number, userId: number | null, created: PlannedEpisode[], fresh: PlannedAssessment[], ref: ReferenceData, ids: IdPool): NewRows {
  const idOf = new Map<string, number>();
  const episodes = new CopyText();
  const interventions = new CopyText();
  for (const e of created) {
    const id = ids.episode();
    idOf.set(e.reference, id);
    const f = e.fields;
    episodes.add(
      `${id}\t${clinicId}\t${v(userId)}\t${v(userId)}\t${v(f.pseudonym)}\t${v(f.reference)}\t${v(f.conditionCode)}\t${v(f.side)}\t${v(f.startDate)}\t${v(f.symptomWeeks)}\t${v(f.ageYears)}\t${v(f.sex)}\t${v(f.heightCm)}\t${v(f.weightKg)}\t${v(f.activityProfile)}\t${v(f.standingWork)}\t${v(f.researchConsent)}\t${v(f.status)}\t${v(f.dischargeDate)}\t${v(f.dischargeReason)}\n`,
    );
    for (const i of e.interventions ?? []) interventions.add(`${id}\t${i.codeId}\t${i.startWeek}\t${v(i.maxLevel)}\n`);
  }
  const assessments = new CopyText();
  const scores = new CopyText();
  for (const a of fresh) {
    const id = ids.assessment();
    const episodeId = a.episodeId ?? idOf.get(a.reference)!;
    assessments.add(`${id}\t${episodeId}\t${v(a.assessedOn)}\t${v(a.timepoint)}\t${v(a.reporter)}\t${v(a.avgDailySteps)}\t${v(a.adverseEvent)}\t${v(userId)}\n`);
    for (const code in a.scores) {
      const value = a.scores[code];
      if (value === null || value === undefined) continue;
      scores.add(`${id}\t${ref.instruments.get(code)!.id}\t${value}\n`);
    }
  }
  return { episodes: episodes.done(), interventions: interventions.done(), assessments: assessments.done(), scores: scores.done() };
}

/** Sends the COPY text: one COPY after the other (a connection takes one query at a time), parents first. */
export async function copyNewRows(client: pg.PoolClient, rows: NewRows): Promise<void> {
  await copyIn(client, 'episode', EPISODE, rows.episodes);
  await copyIn(client, 'episode_intervention', ['episode_id', 'intervention_code_id', 'start_week', 'max_level'], rows.interventions);
  await copyIn(client, 'assessment', ASSESSMENT, rows.assessments);
  await copyIn(client, 'score', ['assessment_id', 'instrument_id', 'value'], rows.scores);
}
