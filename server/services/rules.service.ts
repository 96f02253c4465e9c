import { desc, eq } from 'drizzle-orm';
import { DEFAULT_RULES, RegistryRulesSchema, type RegistryRules } from '../../shared/rules';
import type { Db } from '../db/client';
import { registryRules } from '../db/schema';

export type VersionedRules = { version: number; rules: RegistryRules; changedAt: string | null; changedBy: number | null };

/** The current registry rules (highest version); the shipped defaults as version 0 when none is stored. */
export async function currentRules(db: Db): Promise<VersionedRules> {
  const [row] = await db.select().from(registryRules).orderBy(desc(registryRules.version)).limit(1);
  if (!row) return { version: 0, rules: DEFAULT_RULES, changedAt: null, changedBy: null };
  return {
    version: row.version,
    rules: RegistryRulesSchema.parse(row.rules),
    changedAt: row.changedAt.toISOString(),
    changedBy: row.changedBy,
  };
}

/** The rules of one version (to recompute old numbers under old rules). */
export async function rulesAt(db: Db, version: number): Promise<VersionedRules | null> {
  if (version === 0) return { version: 0, rules: DEFAULT_RULES, changedAt: null, changedBy: null };
  const [row] = await db.select().from(registryRules).where(eq(registryRules.version, version));
  return row
    ? { version: row.version, rules: RegistryRulesSchema.parse(row.rules), changedAt: row.changedAt.toISOString(), changedBy: row.changedBy }
    : null;
}
