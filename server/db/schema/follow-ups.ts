import { sql } from 'drizzle-orm';
import { char, check, date, index, integer, pgTable, serial, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import { FOLLOW_UP_TIMEPOINTS } from '../../../shared/constants';
import { assessments, episodes } from './episodes';
import { users } from './users';

/**
 * A single-use link a patient opens without signing in to report one follow-up.
 * Only the SHA-256 of the random token is stored, so a copy of the database cannot be used to answer.
 * No contact detail of the patient is ever stored: the clinician hands the link over in person.
 */
export const selfReportLinks = pgTable(
  'self_report_link',
  {
    id: serial('id').primaryKey(),
    episodeId: integer('episode_id')
      .notNull()
      .references(() => episodes.id, { onDelete: 'cascade' }),
    timepoint: text('timepoint', { enum: FOLLOW_UP_TIMEPOINTS }).notNull(),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    createdBy: integer('created_by').references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
    assessmentId: integer('assessment_id').references(() => assessments.id, { onDelete: 'set null' }),
  },
  (t) => [
    uniqueIndex('self_report_link_token_uq').on(t.tokenHash),
    index('self_report_link_episode_idx').on(t.episodeId),
    check('self_report_link_hash_hex', sql`${t.tokenHash} ~ '^[0-9a-f]{64}$'`),
  ],
);

/** One row per user and day a reminder digest was decided on: the unique key makes the daily job idempotent. */
export const reminderDigests = pgTable(
  'reminder_digest',
  {
    id: serial('id').primaryKey(),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    day: date('day', { mode: 'string' }).notNull(),
    dueCount: integer('due_count').notNull(),
    closingCount: integer('closing_count').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('reminder_digest_user_day_uq').on(t.userId, t.day)],
);
