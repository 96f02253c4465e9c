import { pgTable, serial, text, timestamp, boolean } from 'drizzle-orm/pg-core';

/** A clinic that submits episodes. `code` is the short public code; the display name never reaches researchers. */
export const clinics = pgTable('clinic', {
  id: serial('id').primaryKey(),
  code: text('code').notNull().unique(),
  displayName: text('display_name').notNull(),
  region: text('region').notNull(),
  active: boolean('active').notNull().default(true),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});
