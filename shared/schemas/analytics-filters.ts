import { z } from 'zod';
import { IsoDateSchema } from './episode';
import { SUBGROUP_KEYS } from './analytics-subgroups';

/**
 * The one filter schema of every analytics endpoint (and of the dashboards' URL search params).
 * - from / to: episode start dates, both inclusive;
 * - condition, instrument: codes of the reference tables (instrument drives responders and change);
 * - clinic: a clinic id, or 'registry' for registry-wide aggregates; absent = the caller's own clinic
 *   (clinic roles) or the whole registry (steward, researcher). The server checks what each role may ask for;
 * - groupBy: the subgroup that splits the recovery curves; subgroup + level narrow any screen to one subgroup.
 */
export const AnalyticsFiltersSchema = z
  .object({
    from: IsoDateSchema.optional(),
    to: IsoDateSchema.optional(),
    condition: z.string().trim().min(1).max(60).optional(),
    instrument: z.string().trim().min(1).max(60).default('nprs-first-step'),
    clinic: z.union([z.literal('registry'), z.coerce.number().int().positive()]).optional(),
    groupBy: z.enum(SUBGROUP_KEYS).default('activity'),
    subgroup: z.enum(SUBGROUP_KEYS).optional(),
    level: z.string().trim().min(1).max(40).optional(),
  })
  .strict()
  .refine((f) => !f.from || !f.to || f.from <= f.to, {
    message: 'The period must end on or after its start',
    path: ['to'],
  })
  .refine((f) => (f.subgroup === undefined) === (f.level === undefined), {
    message: 'Give both a subgroup and one of its levels, or neither',
    path: ['level'],
  });

export type AnalyticsFilters = z.infer<typeof AnalyticsFiltersSchema>;
/** What the client puts in the URL and sends (before defaults are applied). */
export type AnalyticsFiltersInput = z.input<typeof AnalyticsFiltersSchema>;

/** Filter keys in a fixed order: the canonical form used for cache keys and query keys. */
export const ANALYTICS_FILTER_KEYS = [
  'from',
  'to',
  'condition',
  'instrument',
  'clinic',
  'groupBy',
  'subgroup',
  'level',
] as const;

/** A stable string for a parsed filter (same filters → same string, whatever order they arrived in). */
export function canonicalFilters(f: AnalyticsFilters): string {
  return ANALYTICS_FILTER_KEYS.map((k) => `${k}=${f[k] ?? ''}`).join('&');
}

/** The filters as URL search-param strings (the client's form, before the server parses them). */
export type AnalyticsFilterParams = Partial<Record<(typeof ANALYTICS_FILTER_KEYS)[number], string>>;
