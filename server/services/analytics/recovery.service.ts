import { compareRecoveryBySubgroup, summariseRecoveryCurve, type Obs } from '../../../analysis/index';
import type { RecoveryGroup, RecoveryResponse } from '../../../shared/schemas/analytics';
import type { Db } from '../../db/client';
import { metaOf, type AnalyticsContext } from './context';
import { loadEpisodeTuples, type TupleOptions } from './episode-tuples';
import { factsFor, needsSeverity, recoveryCurve, recoveryObs, restrictToSubgroup, subgroupLevel } from './tuple-inputs';
import { suppressSmall } from './suppress';

/** Weeks at which the table reads the cumulative share recovered. */
export const RECOVERY_READ_WEEKS = [6, 12, 26];

type Summary = ReturnType<typeof summariseRecoveryCurve>;

/** The one query of the recovery curves: the subject's episodes (consenting only for researchers). */
export function recoveryTupleOptions(ctx: AnalyticsContext): TupleOptions {
  return {
    cohort: {
      clinicId: ctx.subjectClinic?.id ?? null,
      consentingOnly: ctx.consentingOnly,
      activeClinicsOnly: false,
      filters: ctx.filters,
    },
    ownClinicId: null,
    recovery: {
      instrumentId: ctx.recoveryInstrument.id,
      threshold: ctx.recoveryRule.threshold,
      atLeast: ctx.recoveryRule.direction === 'atLeast',
    },
    // The baseline of the chosen instrument gives the severity band (only fetched when it is needed).
    responder: needsSeverity(ctx)
      ? { instrumentId: ctx.instrument.id, ...ctx.rules.rules.primaryWindow, primary: false }
      : undefined,
    facts: factsFor(ctx.filters, ctx.filters.groupBy),
  };
}

/** Recovery curves by one subgroup variable, with n, events, censored, medians, shares and the log-rank test. */
export async function recoveryBySubgroup(
  db: Db,
  ctx: AnalyticsContext,
  dataVersion: number,
): Promise<RecoveryResponse> {
  const rules = ctx.rules.rules;
  const all = await loadEpisodeTuples(db, recoveryTupleOptions(ctx));
  const tuples = restrictToSubgroup(all, ctx.filters, ctx.instrument);
  const key = ctx.filters.groupBy;
  const minGroupSize = rules.minCellEstimate;
  const items: { obs: Obs; level: string | null }[] = [];
  let nWithoutAssessments = 0;
  for (const t of tuples) {
    const obs = recoveryObs(t);
    if (obs === null) nWithoutAssessments++;
    else items.push({ obs, level: subgroupLevel(key, t, ctx.instrument) });
  }
  const opts = { weeks: RECOVERY_READ_WEEKS, minGroupSize };
  const comparison = compareRecoveryBySubgroup(items, key, opts);
  const obsByLevel = new Map<string, Obs[]>();
  for (const { obs, level } of items) {
    if (level === null) continue;
    const list = obsByLevel.get(level);
    if (list) list.push(obs);
    else obsByLevel.set(level, [obs]);
  }
  const hide = suppressSmall(ctx);
  const group = (level: string, n: number, summary: Summary | null, obs: Obs[]): RecoveryGroup => {
    const curve = summary ? recoveryCurve(obs) : null;
    return {
      level,
      n: hide(n),
      tooFew: summary === null,
      recovered: summary ? hide(summary.recovered) : null,
      censored: summary ? hide(summary.censored) : null,
      median: summary ? summary.medianWeeks : null,
      atWeeks: summary ? summary.atWeeks : [],
      curve: curve?.points ?? null,
      readings: curve?.readings ?? null,
    };
  };
  const allObs = items.map((i) => i.obs);
  const overall = allObs.length >= minGroupSize ? summariseRecoveryCurve(allObs, opts) : null;
  const lr = comparison.logRank;
  return {
    rulesVersion: ctx.rules.version,
    meta: metaOf(ctx, dataVersion),
    groupBy: key,
    rule: {
      instrumentCode: ctx.recoveryInstrument.code,
      instrumentLabel: ctx.recoveryInstrument.label,
      ...ctx.recoveryRule,
    },
    weeks: RECOVERY_READ_WEEKS,
    nEpisodes: hide(tuples.length),
    nWithoutAssessments: hide(nWithoutAssessments),
    nMissingLevel: hide(comparison.nMissingLevel),
    overall: group('all', allObs.length, overall, allObs),
    groups: comparison.levels.map((l) => group(l.level, l.n, l.summary, obsByLevel.get(l.level) ?? [])),
    logRank: lr ? { chiSquare: lr.chiSquare, df: lr.df, pValue: lr.pValue } : null,
    logRankNote: comparison.logRankNote,
  };
}
