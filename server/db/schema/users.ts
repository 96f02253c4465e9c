import { boolean, index, integer, json, pgTable, serial, text, timestamp, varchar } from 'drizzle-orm/pg-core';
import { ROLES } from '../../../shared/roles';
import { clinics } from './clinics';

/** A person who signs in. Created by invitation only; `passwordHash` is null until the invitation is accepted. */
export const users = pgTable('app_user', {
  id: serial('id').primaryKey(),
  email: text('email').notNull().unique(),
  name: text('name').notNull().default(''),
  role: text('role', { enum: ROLES }).notNull(),
  clinicId: integer('clinic_id').references(() => clinics.id),
  passwordHash: text('password_hash'),
  active: boolean('active').notNull().default(true),
  digestOptOut: boolean('digest_opt_out').notNull().default(false),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  deactivatedAt: timestamp('deactivated_at', { withTimezone: true }),
});

/** Sessions of express-session, in the layout connect-pg-simple expects (created here, not at run time). */
export const sessions = pgTable(
  'session',
  {
    sid: varchar('sid').primaryKey(),
    sess: json('sess').notNull(),
    expire: timestamp('expire', { precision: 6 }).notNull(),
  },
  (t) => [index('session_expire_idx').on(t.expire)],
);
