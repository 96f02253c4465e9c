import { boolean, index, integer, json, pgTable, serial, text, timestamp, varchar } from 'drizzle-orm/pg-core';
import { AUTH_TOKEN_PURPOSES } from '../../../shared/account';
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

/**
 * A single-use link sent by e-mail (invitation: 72 h, password reset: 1 h). Only the SHA-256 of the
 * random token is stored, so a copy of the database cannot be used to take over an account.
 */
export const authTokens = pgTable(
  'auth_token',
  {
    id: serial('id').primaryKey(),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: text('purpose', { enum: AUTH_TOKEN_PURPOSES }).notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('auth_token_user_idx').on(t.userId, t.purpose)],
);
