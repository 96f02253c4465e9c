import { desc, eq, sql } from 'drizzle-orm';
import type { CurrentRules, RulesAdmin, RulesUpdate, RulesVersion } from '../../../shared/schemas/admin';
import { DEFAULT_RULES, type RegistryRules } from '../../../shared/rules';
import type { Db } from '../../db/client';
import { instruments, registryRules, users } from '../../db/schema';
import type { Scope } from '../../db/scope';
import { ConflictError, ValidationError } from '../../errors';
import { audit, type Tx } from '../audit';
import { currentRules } from '../rules.service';
import { assertSteward, iso } from './common';
import { diffRules } from './rules-diff';

/** A person's name, or their e-mail while the name is still empty (invited, not yet signed in). */
const displayName = sql<string | null>`coalesce(nullif(${users.name}, ''), ${users.email})`;

const SHIPPED: Omit<RulesVersion, 'changes'> = {
  version: 0,
  rules: DEFAULT_RULES,
  reason: 'Shipped defaults',
  changedAt: null,
  changedById: null,
  changedByName: null,
};

/** Every stored version, newest first, ending with the shipped defaults (version 0); each with its changes. */
export async function rulesHistory(db: Db, scope: Scope): Promise<RulesAdmin> {
  assertSteward(scope);
  const rows = await db
    .select({ version: registryRules.version, rules: registryRules.rules, reason: registryRules.reason, changedAt: registryRules.changedAt, changedById: registryRules.changedBy, changedByName: displayName })
    .from(registryRules)
    .leftJoin(users, eq(users.id, registryRules.changedBy))
    .orderBy(desc(registryRules.version));
  const versions = [...rows.map((r) => ({ ...r, changedAt: iso(r.changedAt) })), SHIPPED];
  const history = versions.map((v, i) => ({ ...v, changes: i + 1 < versions.length ? diffRules(versions[i + 1]!.rules, v.rules) : [] }));
  return { current: history[0]!, history };
}

/** The recovery rule must name a live instrument and a threshold inside its range. */
async function checkRecovery(tx: Tx, rules: RegistryRules): Promise<void> {
  const { instrumentCode, threshold } = rules.recovery;
  const [inst] = await tx.select().from(instruments).where(eq(instruments.code, instrumentCode));
  const path = ['rules', 'recovery'];
  if (!inst) throw new ValidationError(`No instrument has the code ${instrumentCode}`, [{ path: [...path, 'instrumentCode'], message: 'Unknown instrument' }]);
  if (inst.retired) throw new ValidationError(`Instrument ${instrumentCode} is retired`, [{ path: [...path, 'instrumentCode'], message: 'Retired instrument' }]);
  if (threshold < inst.min || threshold > inst.max) {
    throw new ValidationError(`The recovery threshold must lie within ${inst.code}'s range ${inst.min}–${inst.max}`, [
      { path: [...path, 'threshold'], message: `Between ${inst.min} and ${inst.max}` },
    ]);
  }
}

/**
 * Stores a new rules version (old ones stay) and audits it in the same transaction. Changes are
 * serialised by a transaction-level advisory lock so two stewards cannot both build on one version.
 */
export async function updateRules(db: Db, scope: Scope, input: RulesUpdate): Promise<RulesVersion> {
  assertSteward(scope);
  const version = await db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('loadline.registry_rules'))`);
    const current = await currentRules(tx as unknown as Db);
    if (input.baseVersion !== undefined && input.baseVersion !== current.version) {
      throw new ConflictError(`The rules changed meanwhile (now version ${current.version}); reload and apply your change again`);
    }
    const changes = diffRules(current.rules, input.rules);
    if (changes.length === 0) throw new ValidationError('The rules are unchanged; nothing to save');
    await checkRecovery(tx, input.rules);
    const [row] = await tx
      .insert(registryRules)
      .values({ rules: input.rules, reason: input.reason, changedBy: scope.userId })
      .returning({ version: registryRules.version });
    await audit(tx, {
      actorId: scope.userId,
      clinicId: null,
      action: 'update',
      entity: 'registry-rules',
      entityId: row!.version,
      detail: { fromVersion: current.version, reason: input.reason, changes },
    });
    return row!.version;
  });
  const { history } = await rulesHistory(db, scope);
  return history.find((h) => h.version === version)!;
}

/** For every signed-in user: the rules in force, and who changed them last. */
export async function publicCurrentRules(db: Db): Promise<CurrentRules> {
  const current = await currentRules(db);
  let changedByName: string | null = null;
  if (current.changedBy != null) {
    const [u] = await db.select({ name: displayName }).from(users).where(eq(users.id, current.changedBy));
    changedByName = u?.name ?? null;
  }
  return { version: current.version, rules: current.rules, changedAt: current.changedAt, changedByName };
}
