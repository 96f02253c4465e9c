import type { Scope } from '../../db/scope';
import { ForbiddenError } from '../../errors';

type RegistryScope = Extract<Scope, { kind: 'registry' }>;

/** Cohorts and exports are registry work (steward, researcher); a clinic scope never reaches them. */
export function assertRegistry(scope: Scope): asserts scope is RegistryScope {
  if (scope.kind !== 'registry')
    throw new ForbiddenError('Cohorts and research exports are for the registry steward and researchers');
}

export function assertResearcher(scope: Scope): asserts scope is RegistryScope {
  assertRegistry(scope);
  if (!scope.researcher) throw new ForbiddenError('Only a researcher can do this');
}

export function assertSteward(scope: Scope): asserts scope is RegistryScope {
  assertRegistry(scope);
  if (scope.researcher) throw new ForbiddenError('Only the registry steward can do this');
}
