import { bigserial, pgTable, timestamp } from 'drizzle-orm/pg-core';

/**
 * An append-only log of write statements to the registry's outcome data. Statement-level triggers
 * (custom migrations `data_version_triggers` and `data_change_log`) insert one row per insert, update,
 * delete or truncate of the tables the analytics read. The data version is the number of committed rows:
 * it grows whenever any such write commits, and appending takes no shared lock, so a long upload
 * transaction does not make other clinics' writes wait. Rows are never deleted (that would shrink the count).
 */
export const registryDataChanges = pgTable('registry_data_change', {
  id: bigserial('id', { mode: 'number' }).primaryKey(),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
});
