import {
  changeScore,
  compareWithTarget,
  isResponder,
  responderShare,
  summariseChange,
  summariseRecoveryCurve,
  wilsonInterval,
  type Obs,
} from '../../../analysis/index';
import type { OutcomesResponse } from '../../../shared/schemas/analytics';
import type { Db } from '../../db/client';
import { ForbiddenError } from '../../errors';
import { metaOf, publicInstrument, type AnalyticsContext } from './context';
import { loadEpisodeTuplesWithCounts, type EpisodeTuple, type ObsCount, type TupleOptions } from './episode-tuples';
import {
  factsFor,
  needsSeverity,
  followUpWindow,
  recoveryCurve,
  recoveryObs,
  responderInput,
  restrictToSubgroup,
} from './tuple-inputs';

/** The one query of the clinic results: registry-wide tuples, the subject's episodes marked `own`. */
export function outcomesTupleOptions(ctx: AnalyticsContext): TupleOptions {
  const rules = ctx.rules.rules;
  const pw = rules.primaryWindow;
  return {
    // Registry-wide, so the registry curve can be drawn beside the clinic's; `own` marks the subject.
    cohort: { clinicId: null, consentingOnly: false, activeClinicsOnly: false, filters: ctx.filters },
    ownClinicId: ctx.subjectClinic?.id ?? null,
    recovery: {
      instrumentId: ctx.recoveryInstrument.id,
      threshold: ctx.recoveryRule.threshold,
      atLeast: ctx.recoveryRule.direction === 'atLeast',
    },
    // Responders come from the subject's per-instrument columns; every episode's baseline only to narrow by severity.
    responder: needsSeverity(ctx, false) ? { instrumentId: ctx.instrument.id, ...pw, primary: false } : undefined,
    changes: { ...pw, instrumentIds: ctx.instruments.map((i) => i.id) },
    completeness: rules.followUpWindows.week12,
    facts: factsFor(ctx.filters),
    quarter: true,
    // With a clinic as subject and no subgroup to narrow by, the registry curve needs only counts.
    registryAsCounts: ctx.subjectClinic !== null && !ctx.filters.subgroup,
  };
}

/** Clinic results: headline tiles against the three-month expectation, curves, change scores, trend. */
export async function clinicOutcomes(db: Db, ctx: AnalyticsContext, dataVersion: number): Promise<OutcomesResponse> {
  if (ctx.consentingOnly) throw new ForbiddenError('Clinic results are for clinic teams and the steward');
  const rules = ctx.rules.rules;
  const window = followUpWindow(rules);
  const pw = rules.primaryWindow;
  const subjectId = ctx.subjectClinic?.id ?? null;
  const options = outcomesTupleOptions(ctx);
  const { tuples: all, counts } = await loadEpisodeTuplesWithCounts(db, options);
  const tuples = restrictToSubgroup(all, ctx.filters, ctx.instrument);
  const subject = tuples.filter((t) => t.own);
  const minCell = rules.minCellEstimate;
  const obsOf = (list: EpisodeTuple[]) => list.map(recoveryObs).filter((o): o is Obs => o !== null);
  const subjectObs = obsOf(subject);

  const due = subject.filter((t) => t.w12_due);
  const completed = due.filter((t) => t.w12_done).length;
  const mcid = ctx.instrument.mcid;
  const respOpts = { higherIsBetter: ctx.instrument.higherIsBetter, threshold: mcid ?? 1, window };
  const input = (t: EpisodeTuple) => ownResponderInput(t, ctx.instrument.id);
  const resp = mcid === null ? null : responderShare(subject.map(input), respOpts);
  const respShare = resp?.share && resp.nAnalysed >= minCell ? resp.share : null;

  const week = pw.targetWeek;
  const curve = subjectObs.length >= minCell ? summariseRecoveryCurve(subjectObs, { weeks: [week] }) : null;
  const at = curve?.atWeeks[0];
  const recTarget = rules.targets.recoveredByWeek12;
  const meta = metaOf(ctx, dataVersion);
  const registryObs = subjectId === null ? [] : options.registryAsCounts ? expandCounts(counts) : obsOf(tuples);

  return {
    rulesVersion: ctx.rules.version,
    meta,
    instrument: publicInstrument(ctx.instrument),
    recoveryRule: {
      instrumentCode: ctx.recoveryInstrument.code,
      instrumentLabel: ctx.recoveryInstrument.label,
      ...ctx.recoveryRule,
    },
    targetWeek: week,
    tiles: {
      episodes: subject.length,
      completeness: {
        due: due.length,
        completed,
        share: due.length > 0 ? wilsonInterval(completed, due.length) : null,
        target: rules.completenessTarget,
        window: rules.followUpWindows.week12,
      },
      responders: resp && {
        nEpisodes: resp.nEpisodes,
        nAnalysed: resp.nAnalysed,
        nMissingBaseline: resp.nMissingBaseline,
        nMissingFollowUp: resp.nMissingFollowUp,
        responders: resp.responders,
        share: respShare,
        target: rules.targets.respondersAtWeek12,
        position: respShare ? compareWithTarget(respShare, rules.targets.respondersAtWeek12) : null,
      },
      recovered: {
        n: subjectObs.length,
        share: at ? { estimate: at.estimate, lower: at.lower, upper: at.upper } : null,
        target: recTarget,
        position: at && at.estimate !== null ? compareWithTarget(at, recTarget) : null,
        setBy: ctx.rulesSetBy,
        setAt: ctx.rules.changedAt,
      },
      medianWeeks: curve ? curve.medianWeeks : null,
    },
    curves: [
      {
        series: 'subject' as const,
        label: meta.subject.label,
        n: subjectObs.length,
        ...(subjectObs.length >= minCell ? recoveryCurve(subjectObs) : { points: [], readings: [] }),
      },
      ...(subjectId === null
        ? []
        : [
            {
              series: 'registry' as const,
              label: 'Whole registry',
              n: registryObs.length,
              ...recoveryCurve(registryObs),
            },
          ]),
    ],
    changes: changeDistributions(ctx, subject),
    trend: responderTrend(subject, input, respOpts, mcid === null, minCell),
  };
}

function changeDistributions(ctx: AnalyticsContext, subject: EpisodeTuple[]): OutcomesResponse['changes'] {
  const pairs = new Map<number, { baseline: number; followUp: number }[]>();
  for (const t of subject) {
    for (const [instrumentId, baseline, weeks, value] of t.changes ?? []) {
      if (baseline === null || weeks === null || value === null) continue;
      const list = pairs.get(instrumentId) ?? [];
      list.push({ baseline, followUp: value });
      pairs.set(instrumentId, list);
    }
  }
  return ctx.instruments
    .filter((i) => (pairs.get(i.id)?.length ?? 0) > 0)
    .map((i) => {
      const list = pairs.get(i.id) ?? [];
      const values = list.map((p) => changeScore(p.baseline, p.followUp, i.higherIsBetter));
      const s = summariseChange(list, { higherIsBetter: i.higherIsBetter });
      return {
        instrument: publicInstrument(i),
        values,
        n: s.n,
        meanChange: s.meanChange,
        meanLower: s.meanChangeCi?.lower ?? null,
        meanUpper: s.meanChangeCi?.upper ?? null,
        median: s.median,
        q1: s.q1,
        q3: s.q3,
        atLeastMcid: i.mcid === null ? null : values.filter((v) => isResponder(v, i.mcid as number)).length,
      };
    });
}

/** One observation per episode again, from the counts per (time, event). */
function expandCounts(counts: ObsCount[]): Obs[] {
  const out: Obs[] = [];
  for (const c of counts) for (let k = 0; k < c.n; k++) out.push({ time: c.time, event: c.event });
  return out;
}

/** Baseline and primary follow-up of one instrument from the subject's per-instrument columns. */
function ownResponderInput(t: EpisodeTuple, instrumentId: number) {
  const c = t.changes?.find((x) => x[0] === instrumentId);
  return responderInput({ baseline: c?.[1] ?? null, primary_weeks: c?.[2] ?? null, primary_value: c?.[3] ?? null });
}

function responderTrend(
  subject: EpisodeTuple[],
  input: (t: EpisodeTuple) => ReturnType<typeof responderInput>,
  opts: Parameters<typeof responderShare>[1],
  noMcid: boolean,
  minCell: number,
): OutcomesResponse['trend'] {
  if (noMcid) return [];
  const byQuarter = new Map<string, EpisodeTuple[]>();
  for (const t of subject) {
    const q = t.quarter ?? '?';
    const list = byQuarter.get(q);
    if (list) list.push(t);
    else byQuarter.set(q, [t]);
  }
  return [...byQuarter.keys()].sort().map((quarter) => {
    const r = responderShare((byQuarter.get(quarter) ?? []).map(input), opts);
    const tooFew = r.nAnalysed < minCell;
    return { quarter, nAnalysed: r.nAnalysed, responders: r.responders, share: tooFew ? null : r.share, tooFew };
  });
}
