import { z } from 'zod';
import { RegistryRulesSchema } from '../rules';

const text = (min: number, max: number, what: string) =>
  z.string().trim().min(min, `Enter the ${what}`).max(max, `Keep the ${what} to ${max} characters`);
const timestamp = z.string();

// ---------- registry rules ----------

const RULE_KEYS = Object.keys(RegistryRulesSchema.shape);

/** A whole rules record: every setting must be given (a missing one must never fall back to a default silently). */
export const FullRulesSchema = z
  .record(z.string(), z.unknown())
  .superRefine((v, ctx) => {
    for (const k of RULE_KEYS) if (!(k in v)) ctx.addIssue({ code: 'custom', path: [k], message: `Give the setting ${k}` });
    for (const k of Object.keys(v)) if (!RULE_KEYS.includes(k)) ctx.addIssue({ code: 'custom', path: [k], message: `Unknown setting ${k}` });
  })
  .pipe(RegistryRulesSchema.required())
  .superRefine((r, ctx) => {
    const p = r.primaryWindow;
    if (!(p.fromWeek <= p.targetWeek && p.targetWeek <= p.toWeek)) {
      ctx.addIssue({ code: 'custom', path: ['primaryWindow'], message: 'The target week must lie inside the window' });
    }
    const w = r.followUpWindows;
    if (!(w.week6.toDay < w.week12.fromDay && w.week12.toDay < w.week26.fromDay)) {
      ctx.addIssue({ code: 'custom', path: ['followUpWindows'], message: 'The follow-up windows must not overlap and must be in order' });
    }
    if (r.minCellResearcher > r.minCellEstimate) {
      ctx.addIssue({ code: 'custom', path: ['minCellResearcher'], message: 'The researcher count limit cannot exceed the estimate limit' });
    }
  });

export const RulesUpdateSchema = z
  .object({
    rules: FullRulesSchema,
    reason: text(5, 500, 'reason for the change'),
    /** The version the form was based on; a newer stored version answers 409. */
    baseVersion: z.number().int().min(0).optional(),
  })
  .strict();
export type RulesUpdate = z.infer<typeof RulesUpdateSchema>;

export const RuleChangeSchema = z.object({ path: z.string(), from: z.unknown(), to: z.unknown() });

export const RulesVersionSchema = z.object({
  version: z.number().int(),
  rules: RegistryRulesSchema,
  reason: z.string(),
  changedAt: timestamp.nullable(),
  changedById: z.number().int().nullable(),
  changedByName: z.string().nullable(),
  /** What differs from the version before (empty for the shipped defaults). */
  changes: z.array(RuleChangeSchema),
});
export type RulesVersion = z.infer<typeof RulesVersionSchema>;

export const RulesAdminSchema = z.object({ current: RulesVersionSchema, history: z.array(RulesVersionSchema) });
export type RulesAdmin = z.infer<typeof RulesAdminSchema>;

/** GET /api/rules/current: which rules the numbers on a dashboard use. */
export const CurrentRulesSchema = z.object({
  version: z.number().int(),
  rules: RegistryRulesSchema,
  changedAt: timestamp.nullable(),
  changedByName: z.string().nullable(),
});
export type CurrentRules = z.infer<typeof CurrentRulesSchema>;
