import { sql } from 'drizzle-orm';
import { bigint, check, integer, pgTable } from 'drizzle-orm/pg-core';

/**
 * One row counting writes to the registry's outcome data. Statement-level triggers (custom migration
 * `data_version_triggers`) bump it on every insert, update, delete or truncate of the tables the analytics
 * read, so a cached result keyed by this number is never served after the data changed.
 */
export const registryDataVersion = pgTable(
  'registry_data_version',
  {
    id: integer('id').primaryKey().default(1),
    version: bigint('version', { mode: 'number' }).notNull().default(0),
  },
  (t) => [check('registry_data_version_single_row', sql`${t.id} = 1`)],
);
