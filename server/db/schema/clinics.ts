import { randomBytes } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { pgTable, serial, text, timestamp, boolean, check } from 'drizzle-orm/pg-core';

/** A clinic that submits episodes. `code` is the short public code; the display name never reaches researchers. */
export const clinics = pgTable(
  'clinic',
  {
    id: serial('id').primaryKey(),
    code: text('code').notNull().unique(),
    displayName: text('display_name').notNull(),
    region: text('region').notNull(),
    active: boolean('active').notNull().default(true),
    /**
     * Per-clinic PBKDF2 salt for pseudonym keys (16 random bytes, hex). Not a secret: it only makes one
     * clinic's passphrase give a different key from another's. New rows get 16 bytes from node:crypto;
     * the SQL default (122 random bits of a v4 UUID) covers rows that existed before the column and raw inserts.
     */
    pseudonymSalt: text('pseudonym_salt')
      .notNull()
      .default(sql`replace(gen_random_uuid()::text, '-', '')`)
      .$defaultFn(() => randomBytes(16).toString('hex')),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check('clinic_pseudonym_salt_hex', sql`${t.pseudonymSalt} ~ '^[0-9a-f]{32}$'`)],
);
