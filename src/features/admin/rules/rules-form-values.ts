import type { Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { RulesUpdateSchema } from '../../../../shared/schemas/admin';
import type { RegistryRules } from '../../../../shared/rules';
import { friendlyIssue } from '../../episodes/form-validation';

/** What the rules form holds: a whole rules record, the reason, and the version it started from. */
export type RulesFormValues = { rules: RegistryRules; reason: string; baseVersion: number };

/**
 * The shared schema, unchanged: the form checks exactly what the server checks (every setting given,
 * windows in order, export k at least 3, a reason). Its input type is a loose record, hence the cast.
 */
export const rulesResolver = zodResolver(RulesUpdateSchema, {
  error: friendlyIssue,
}) as unknown as Resolver<RulesFormValues>;
