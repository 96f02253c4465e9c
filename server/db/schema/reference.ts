import { boolean, integer, numeric, pgTable, serial, text, timestamp } from 'drizzle-orm/pg-core';
import { INTERVENTION_KINDS } from '../../../shared/constants';
import { clinics } from './clinics';

/** Conditions the registry accepts (data, so more can be added). */
export const conditions = pgTable('condition', {
  code: text('code').primaryKey(),
  label: text('label').notNull(),
  icd10: text('icd10').notNull(),
});

/** Outcome measures, as rows: only totals are ever stored, never items or their wording. */
export const instruments = pgTable('instrument', {
  id: serial('id').primaryKey(),
  code: text('code').notNull().unique(),
  label: text('label').notNull(),
  unit: text('unit').notNull(),
  min: numeric('min', { mode: 'number' }).notNull(),
  max: numeric('max', { mode: 'number' }).notNull(),
  higherIsBetter: boolean('higher_is_better').notNull(),
  mcid: numeric('mcid', { mode: 'number' }),
  mcidSource: text('mcid_source').notNull(),
  bodyRegion: text('body_region').notNull(),
  retired: boolean('retired').notNull().default(false),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

/** Intervention codes: core programme and add-ons; a clinic's own codes are proposed, then accepted. */
export const interventionCodes = pgTable('intervention_code', {
  id: serial('id').primaryKey(),
  code: text('code').notNull().unique(),
  label: text('label').notNull(),
  kind: text('kind', { enum: INTERVENTION_KINDS }).notNull(),
  graded: boolean('graded').notNull().default(false),
  proposedByClinicId: integer('proposed_by_clinic_id').references(() => clinics.id),
  status: text('status', { enum: ['accepted', 'proposed', 'declined'] }).notNull().default('accepted'),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});
