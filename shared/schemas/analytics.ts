import { z } from 'zod';
import { ROLES } from '../roles';
import { AnalyticsFiltersSchema } from './analytics-filters';
import { SUBGROUP_KEYS } from './analytics-subgroups';

/** Response schemas of /api/analytics/*; the client parses every answer with these. */

const num = z.number();
const maybe = z.number().nullable();
/** A count; null when it is below the researcher cell minimum (shown as "<k"). */
const count = z.number().int().nullable();

export const IntervalSchema = z.object({ estimate: maybe, lower: maybe, upper: maybe });
export type Interval = z.infer<typeof IntervalSchema>;
export const TargetPositionSchema = z.enum(['above', 'within', 'below']);

export const InstrumentInfoSchema = z.object({
  code: z.string(),
  label: z.string(),
  unit: z.string(),
  min: num,
  max: num,
  higherIsBetter: z.boolean(),
  mcid: maybe,
  mcidSource: z.string(),
});
export type InstrumentInfo = z.infer<typeof InstrumentInfoSchema>;

const OptionSchema = z.object({ code: z.string(), label: z.string() });

export const AnalyticsMetaSchema = z.object({
  /** Which registry rules version the numbers use. */
  rulesVersion: z.number().int(),
  dataVersion: z.number().int(),
  computedAt: z.string(),
  viewerRole: z.enum(ROLES),
  filters: AnalyticsFiltersSchema,
  /** Whose episodes the numbers describe. */
  subject: z.object({ kind: z.enum(['clinic', 'registry']), clinicId: z.number().int().nullable(), label: z.string() }),
  consentingOnly: z.boolean(),
  /** Counts below this are hidden for researchers (null = nothing hidden). */
  minCellShown: z.number().int().nullable(),
  minCellEstimate: z.number().int(),
  options: z.object({
    instruments: z.array(OptionSchema.extend({ hasMcid: z.boolean() })),
    conditions: z.array(OptionSchema),
    /** Only for the steward: every clinic, for the clinic picker. */
    clinics: z.array(z.object({ id: z.number().int(), code: z.string(), name: z.string(), active: z.boolean() })),
  }),
});
export type AnalyticsMeta = z.infer<typeof AnalyticsMetaSchema>;

/** One point of a cumulative recovery curve: share recovered by `weeks` with its CI. */
export const CurvePointSchema = z.object({ weeks: num, share: num, lower: maybe, upper: maybe });
export type CurvePoint = z.infer<typeof CurvePointSchema>;

export const RecoveryRuleInfoSchema = z.object({
  instrumentCode: z.string(),
  instrumentLabel: z.string(),
  threshold: num,
  direction: z.enum(['atMost', 'atLeast']),
});

// ---- GET /api/analytics/outcomes (clinic results)

export const ResponderTileSchema = z.object({
  nEpisodes: z.number().int(),
  nAnalysed: z.number().int(),
  nMissingBaseline: z.number().int(),
  nMissingFollowUp: z.number().int(),
  responders: z.number().int(),
  share: IntervalSchema.nullable(),
  target: num,
  position: TargetPositionSchema.nullable(),
});

export const OutcomesResponseSchema = z.object({
  /** The registry rules version these numbers use (also in meta). */
  rulesVersion: z.number().int(),
  meta: AnalyticsMetaSchema,
  instrument: InstrumentInfoSchema,
  recoveryRule: RecoveryRuleInfoSchema,
  targetWeek: num,
  tiles: z.object({
    episodes: z.number().int(),
    completeness: z.object({
      due: z.number().int(),
      completed: z.number().int(),
      share: IntervalSchema.nullable(),
      target: num,
      window: z.object({ fromDay: z.number().int(), toDay: z.number().int() }),
    }),
    /** null when the instrument has no MCID. */
    responders: ResponderTileSchema.nullable(),
    recovered: z.object({
      n: z.number().int(),
      share: IntervalSchema.nullable(),
      target: num,
      position: TargetPositionSchema.nullable(),
      /** Who set the target and when (null = the shipped default). */
      setBy: z.string().nullable(),
      setAt: z.string().nullable(),
    }),
    medianWeeks: IntervalSchema.nullable(),
  }),
  curves: z.array(
    z.object({
      series: z.enum(['subject', 'registry']),
      label: z.string(),
      n: z.number().int(),
      points: z.array(CurvePointSchema),
      /** The share recovered every two weeks up to the last follow-up (the table behind the chart). */
      readings: z.array(CurvePointSchema),
    }),
  ),
  changes: z.array(
    z.object({
      instrument: InstrumentInfoSchema,
      values: z.array(num),
      n: z.number().int(),
      meanChange: maybe,
      meanLower: maybe,
      meanUpper: maybe,
      median: maybe,
      q1: maybe,
      q3: maybe,
      atLeastMcid: z.number().int().nullable(),
    }),
  ),
  trend: z.array(
    z.object({
      quarter: z.string(),
      nAnalysed: z.number().int(),
      responders: z.number().int(),
      share: IntervalSchema.nullable(),
      tooFew: z.boolean(),
    }),
  ),
});
export type OutcomesResponse = z.infer<typeof OutcomesResponseSchema>;

// ---- GET /api/analytics/recovery

export const RecoveryGroupSchema = z.object({
  level: z.string(),
  n: count,
  tooFew: z.boolean(),
  recovered: count,
  censored: count,
  median: IntervalSchema.nullable(),
  atWeeks: z.array(z.object({ weeks: num, estimate: maybe, lower: maybe, upper: maybe })),
  curve: z.array(CurvePointSchema).nullable(),
  readings: z.array(CurvePointSchema).nullable(),
});
export type RecoveryGroup = z.infer<typeof RecoveryGroupSchema>;

export const RecoveryResponseSchema = z.object({
  /** The registry rules version these numbers use (also in meta). */
  rulesVersion: z.number().int(),
  meta: AnalyticsMetaSchema,
  groupBy: z.enum(SUBGROUP_KEYS),
  rule: RecoveryRuleInfoSchema,
  weeks: z.array(num),
  nEpisodes: count,
  nWithoutAssessments: count,
  nMissingLevel: count,
  overall: RecoveryGroupSchema,
  groups: z.array(RecoveryGroupSchema),
  logRank: z.object({ chiSquare: num, df: z.number().int(), pValue: num }).nullable(),
  logRankNote: z.string().nullable(),
});
export type RecoveryResponse = z.infer<typeof RecoveryResponseSchema>;

// ---- GET /api/analytics/addons

const RatioSchema = z.object({ riskRatio: num, lower: num, upper: num });
export const AddOnRowSchema = z.object({
  code: z.string(),
  label: z.string(),
  withAddOn: z.object({ n: count, responders: count }),
  withoutAddOn: z.object({ n: count, responders: count }),
  suppressed: z.boolean(),
  crude: RatioSchema.nullable(),
  adjusted: RatioSchema.nullable(),
  riskDifference: z.object({ difference: num, lower: num, upper: num }).nullable(),
  mhStrata: z.number().int(),
  pValue: maybe,
  pAdjusted: maybe,
});
export type AddOnRow = z.infer<typeof AddOnRowSchema>;

export const AddOnsResponseSchema = z.object({
  /** The registry rules version these numbers use (also in meta). */
  rulesVersion: z.number().int(),
  meta: AnalyticsMetaSchema,
  instrument: InstrumentInfoSchema,
  nEpisodes: count,
  nMissingOutcome: count,
  minArm: z.number().int(),
  stratifiedBy: z.string(),
  rows: z.array(AddOnRowSchema),
});
export type AddOnsResponse = z.infer<typeof AddOnsResponseSchema>;

// ---- GET /api/analytics/clinics (peer comparison)

const FunnelMeasureSchema = z.object({
  n: z.number().int(),
  /** null (with share and flags) when it, or its complement, is a small cell a researcher may not see. */
  count: z.number().int().nullable(),
  share: maybe,
  flag95: TargetPositionSchema.nullable(),
  flag998: TargetPositionSchema.nullable(),
});
const LimitRowSchema = z.object({ n: z.number().int(), lower95: num, upper95: num, lower998: num, upper998: num });

export const ClinicsResponseSchema = z.object({
  /** The registry rules version these numbers use (also in meta). */
  rulesVersion: z.number().int(),
  meta: AnalyticsMetaSchema,
  instrument: InstrumentInfoSchema,
  targetWeek: num,
  centre: z.object({ responder: maybe, recovered: maybe }),
  minEpisodes: z.number().int(),
  /** Active clinics left out because they have fewer episodes than minEpisodes. */
  hiddenSmall: z.number().int(),
  clinics: z.array(
    z.object({
      /** Own code for the viewer's clinic (and for the steward); an anonymous per-request label otherwise. */
      label: z.string(),
      highlighted: z.boolean(),
      /** Display name: the steward only. */
      name: z.string().nullable(),
      nEpisodes: z.number().int(),
      responder: FunnelMeasureSchema,
      recovered: FunnelMeasureSchema,
    }),
  ),
  limits: z.object({ responder: z.array(LimitRowSchema), recovered: z.array(LimitRowSchema) }),
});
export type ClinicsResponse = z.infer<typeof ClinicsResponseSchema>;

// ---- GET /api/analytics/episodes/:id/trajectory

export const TrajectoryResponseSchema = z.object({
  /** The registry rules version these numbers use (also in meta). */
  rulesVersion: z.number().int(),
  meta: AnalyticsMetaSchema,
  episode: z.object({ id: z.number().int(), reference: z.string(), startDate: z.string(), status: z.string() }),
  instruments: z.array(
    z.object({
      instrument: InstrumentInfoSchema,
      baseline: maybe,
      /** Score that would be an improvement of one MCID from baseline (null when no MCID or no baseline). */
      mcidLevel: maybe,
      points: z.array(z.object({ weeks: num, value: num, assessedOn: z.string(), timepoint: z.string() })),
    }),
  ),
  steps: z.array(z.object({ weeks: num, steps: z.number().int(), assessedOn: z.string() })),
  /** Follow-ups where first-step pain rose by `riseThreshold` or more from the previous assessment. */
  flags: z.array(z.object({ weeks: num, assessedOn: z.string(), previous: num, value: num })),
  riseThreshold: num,
});
export type TrajectoryResponse = z.infer<typeof TrajectoryResponseSchema>;
