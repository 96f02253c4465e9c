import { z } from 'zod';

/** A follow-up window in days since the episode's start, inclusive at both ends. */
const WindowSchema = z
  .object({ fromDay: z.number().int().min(0), toDay: z.number().int().min(0) })
  .refine((w) => w.toDay >= w.fromDay, 'The window must end on or after its first day');

/**
 * The registry's rules, one versioned record (the steward changes them; every change keeps the old version).
 * The defaults are registry settings chosen by us, not published norms.
 */
export const RegistryRulesSchema = z.object({
  /** Recovery is reached at the first assessment whose score on this instrument is at or past the threshold. */
  recovery: z.object({ instrumentCode: z.string().min(1), threshold: z.number() }).default({
    instrumentCode: 'nprs-first-step',
    threshold: 2, // first-step pain <= 2/10: common practice, no published source
  }),
  /** The primary follow-up is the assessment nearest week 12 inside this window (weeks). */
  primaryWindow: z
    .object({ fromWeek: z.number().min(0), toWeek: z.number().min(0), targetWeek: z.number().min(0) })
    .default({ fromWeek: 10, toWeek: 16, targetWeek: 12 }),
  followUpWindows: z
    .object({ week6: WindowSchema, week12: WindowSchema, week26: WindowSchema })
    .default({ week6: { fromDay: 35, toDay: 56 }, week12: { fromDay: 70, toDay: 112 }, week26: { fromDay: 168, toDay: 210 } }),
  /** Three-month expectation targets (shares, 0–1): registry settings, not published figures. */
  targets: z
    .object({ recoveredByWeek12: z.number().min(0).max(1), respondersAtWeek12: z.number().min(0).max(1) })
    .default({ recoveredByWeek12: 0.5, respondersAtWeek12: 0.6 }),
  /** Smallest group for which an estimate is shown. */
  minCellEstimate: z.number().int().min(1).default(10),
  /** Smallest count shown to researchers (smaller shown as "<k"). */
  minCellResearcher: z.number().int().min(3).default(5),
  /** k of the k-anonymity check on exports (never below 3). */
  exportK: z.number().int().min(3).default(5),
  /** Target follow-up completeness (common practice). */
  completenessTarget: z.number().min(0).max(1).default(0.8),
});
export type RegistryRules = z.infer<typeof RegistryRulesSchema>;
export const DEFAULT_RULES: RegistryRules = RegistryRulesSchema.parse({});
