import { sql } from 'drizzle-orm';
import {
  boolean,
  check,
  date,
  index,
  integer,
  jsonb,
  pgTable,
  serial,
  text,
  timestamp,
  uniqueIndex,
} from 'drizzle-orm/pg-core';
import type { CohortCriteria } from '../../../shared/schemas/cohort';
import {
  DATA_REQUEST_STATUSES,
  EXPORT_STATUSES,
  START_GRANULARITIES,
  type VariableGroup,
} from '../../../shared/export-columns';
import { users } from './users';

/** A named cohort definition; its criteria live in versions (every save keeps the old one). */
export const cohorts = pgTable(
  'cohort',
  {
    id: serial('id').primaryKey(),
    ownerId: integer('owner_id')
      .notNull()
      .references(() => users.id),
    name: text('name').notNull(),
    description: text('description').notNull().default(''),
    currentVersion: integer('current_version').notNull().default(1),
    duplicatedFromId: integer('duplicated_from_id'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('cohort_owner_idx').on(t.ownerId)],
);

/** One saved version of a cohort's criteria, with the count it had when it was saved. */
export const cohortVersions = pgTable(
  'cohort_version',
  {
    id: serial('id').primaryKey(),
    cohortId: integer('cohort_id')
      .notNull()
      .references(() => cohorts.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    criteria: jsonb('criteria').$type<CohortCriteria>().notNull(),
    countAtSave: integer('count_at_save').notNull(),
    clinicsAtSave: integer('clinics_at_save').notNull(),
    rulesVersion: integer('rules_version').notNull(),
    savedBy: integer('saved_by')
      .notNull()
      .references(() => users.id),
    savedAt: timestamp('saved_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('cohort_version_uq').on(t.cohortId, t.version)],
);

/** A researcher's request to export one cohort version; the steward approves (with conditions) or declines. */
export const dataRequests = pgTable(
  'data_request',
  {
    id: serial('id').primaryKey(),
    cohortVersionId: integer('cohort_version_id')
      .notNull()
      .references(() => cohortVersions.id),
    requesterId: integer('requester_id')
      .notNull()
      .references(() => users.id),
    purpose: text('purpose').notNull(),
    variableGroups: jsonb('variable_groups').$type<VariableGroup[]>().notNull(),
    status: text('status', { enum: DATA_REQUEST_STATUSES }).notNull().default('pending'),
    decidedBy: integer('decided_by').references(() => users.id),
    decidedAt: timestamp('decided_at', { withTimezone: true }),
    declineReason: text('decline_reason'),
    /** Last day (inclusive) on which the requester may download. */
    expiresOn: date('expires_on', { mode: 'string' }),
    startGranularity: text('start_granularity', { enum: START_GRANULARITIES }),
    allowRawBmi: boolean('allow_raw_bmi').notNull().default(false),
    k: integer('k'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('data_request_requester_idx').on(t.requesterId),
    check('data_request_k_min', sql`${t.k} is null or ${t.k} >= 3`),
  ],
);

/** One CSV download of an approved request: who, how many rows, the file's SHA-256, and how it ended. */
export const exportLog = pgTable(
  'export_log',
  {
    id: serial('id').primaryKey(),
    requestId: integer('request_id')
      .notNull()
      .references(() => dataRequests.id),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id),
    status: text('status', { enum: EXPORT_STATUSES }).notNull(),
    rowCount: integer('row_count').notNull(),
    generalisedRows: integer('generalised_rows').notNull(),
    suppressedRows: integer('suppressed_rows').notNull(),
    k: integer('k').notNull(),
    byteCount: integer('byte_count').notNull(),
    sha256: text('sha256').notNull(),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull(),
    finishedAt: timestamp('finished_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('export_log_request_idx').on(t.requestId), index('export_log_finished_idx').on(t.finishedAt)],
);
