import { sql } from 'drizzle-orm';
import {
  boolean, char, check, date, index, integer, numeric, pgTable, primaryKey, serial, text, timestamp, uniqueIndex,
} from 'drizzle-orm/pg-core';
import {
  ACTIVITY_PROFILES, DISCHARGE_REASONS, EPISODE_STATUSES, REPORTERS, SEXES, SIDES, TIMEPOINTS,
} from '../../../shared/constants';

/**
 * Episode, assessment, score and episode_intervention reference their parents through statement-level triggers
 * instead of foreign key constraints (migration 0012_ref_triggers): the same rules (a missing parent is refused;
 * deleting an episode or assessment deletes its children; deleting or re-keying a referenced row is refused;
 * a concurrent delete of a parent waits), checked once per statement and distinct parent instead of once per
 * row, which is what lets a 100,000-row upload commit in seconds. The `// →` comments name each reference.
 */

/** One pseudonymised episode of care. Never holds a direct identifier; BMI is derived from height and weight. */
export const episodes = pgTable(
  'episode',
  {
    id: serial('id').primaryKey(),
    clinicId: integer('clinic_id').notNull(), // → clinic.id (trigger)
    pseudonym: char('pseudonym', { length: 64 }).notNull(),
    reference: text('reference').notNull(),
    conditionCode: text('condition_code').notNull(), // → condition.code (trigger)
    side: text('side', { enum: SIDES }).notNull(),
    startDate: date('start_date', { mode: 'string' }).notNull(),
    symptomWeeks: integer('symptom_weeks').notNull(),
    ageYears: integer('age_years').notNull(),
    sex: text('sex', { enum: SEXES }).notNull(),
    heightCm: numeric('height_cm', { mode: 'number' }).notNull(),
    weightKg: numeric('weight_kg', { mode: 'number' }).notNull(),
    activityProfile: text('activity_profile', { enum: ACTIVITY_PROFILES }).notNull(),
    standingWork: boolean('standing_work').notNull(),
    researchConsent: boolean('research_consent').notNull(),
    status: text('status', { enum: EPISODE_STATUSES }).notNull().default('open'),
    dischargeDate: date('discharge_date', { mode: 'string' }),
    dischargeReason: text('discharge_reason', { enum: DISCHARGE_REASONS }),
    version: integer('version').notNull().default(1),
    createdBy: integer('created_by'), // → app_user.id (trigger)
    updatedBy: integer('updated_by'), // → app_user.id (trigger)
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('episode_clinic_reference_uq').on(t.clinicId, t.reference),
    index('episode_clinic_start_idx').on(t.clinicId, t.startDate),
    check('episode_pseudonym_hex', sql`${t.pseudonym} ~ '^[0-9a-f]{64}$'`),
  ],
);


/** An assessment at a timepoint; its scores are rows of `score`. Weeks since start are derived, not stored. */
export const assessments = pgTable(
  'assessment',
  {
    id: serial('id').primaryKey(),
    episodeId: integer('episode_id').notNull(), // → episode.id, on delete cascade (trigger)
    assessedOn: date('assessed_on', { mode: 'string' }).notNull(),
    timepoint: text('timepoint', { enum: TIMEPOINTS }).notNull(),
    reporter: text('reporter', { enum: REPORTERS }).notNull(),
    avgDailySteps: integer('avg_daily_steps'),
    adverseEvent: text('adverse_event'),
    createdBy: integer('created_by'), // → app_user.id (trigger)
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('assessment_one_baseline_uq').on(t.episodeId).where(sql`${t.timepoint} = 'baseline'`),
    uniqueIndex('assessment_natural_key_uq').on(t.episodeId, t.assessedOn, t.timepoint),
  ],
);

export const scores = pgTable(
  'score',
  {
    assessmentId: integer('assessment_id').notNull(), // → assessment.id, on delete cascade (trigger)
    instrumentId: integer('instrument_id').notNull(), // → instrument.id (trigger)
    value: numeric('value', { mode: 'number' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.assessmentId, t.instrumentId] }), index('score_instrument_idx').on(t.instrumentId)],
);

/** What an episode received: a code, from which week, and for graded programmes the highest level (1–3). */
export const episodeInterventions = pgTable(
  'episode_intervention',
  {
    episodeId: integer('episode_id').notNull(), // → episode.id, on delete cascade (trigger)
    interventionCodeId: integer('intervention_code_id').notNull(), // → intervention_code.id (trigger)
    startWeek: integer('start_week').notNull().default(0),
    maxLevel: integer('max_level'),
  },
  (t) => [
    primaryKey({ columns: [t.episodeId, t.interventionCodeId] }),
    check('episode_intervention_level', sql`${t.maxLevel} is null or ${t.maxLevel} between 1 and 3`),
  ],
);
