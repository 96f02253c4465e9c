import { bigserial, index, integer, jsonb, pgTable, serial, text, timestamp } from 'drizzle-orm/pg-core';
import type { RegistryRules } from '../../../shared/rules';
import { clinics } from './clinics';
import { users } from './users';

/** A CSV upload, dry run or committed. */
export const uploads = pgTable('upload', {
  id: serial('id').primaryKey(),
  clinicId: integer('clinic_id').notNull().references(() => clinics.id),
  userId: integer('user_id').references(() => users.id),
  fileName: text('file_name').notNull(),
  fileSha256: text('file_sha256').notNull(),
  rowCount: integer('row_count').notNull(),
  accepted: integer('accepted').notNull(),
  rejected: integer('rejected').notNull(),
  status: text('status', { enum: ['dry-run', 'committed', 'rejected'] }).notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

/** Every create, update, delete, upload and export writes one, in the same transaction. */
export const auditEvents = pgTable(
  'audit_event',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    actorId: integer('actor_id').references(() => users.id),
    clinicId: integer('clinic_id').references(() => clinics.id),
    action: text('action').notNull(),
    entity: text('entity').notNull(),
    entityId: text('entity_id'),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
  },
  (t) => [index('audit_event_at_idx').on(t.at), index('audit_event_clinic_idx').on(t.clinicId, t.at)],
);

/** The registry's rules, versioned: the row with the highest id is current; old rows are kept. */
export const registryRules = pgTable('registry_rules', {
  version: serial('version').primaryKey(),
  rules: jsonb('rules').$type<RegistryRules>().notNull(),
  reason: text('reason').notNull(),
  changedBy: integer('changed_by').references(() => users.id),
  changedAt: timestamp('changed_at', { withTimezone: true }).notNull().defaultNow(),
});
