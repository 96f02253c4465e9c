import { randomInt } from 'node:crypto';
import {
  classifyResponder,
  clinicComparison,
  funnelLimits,
  recoveredByWeek,
  type ClinicEpisode,
  type FunnelPoint,
} from '../../../analysis/index';
import type { ClinicsResponse } from '../../../shared/schemas/analytics';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { metaOf, publicInstrument, type AnalyticsContext } from './context';
import { loadEpisodeTuples, type TupleOptions } from './episode-tuples';
import { factsFor, followUpWindow, recoveryObs, responderInput, restrictToSubgroup } from './tuple-inputs';

type Measure = ClinicsResponse['clinics'][number]['responder'];
/** The cached, viewer-independent comparison: clinics still carry their ids. */
export type ClinicComparisonResult = Omit<ClinicsResponse, 'clinics'> & {
  clinics: (Omit<ClinicsResponse['clinics'][number], 'label' | 'highlighted' | 'name'> & {
    clinicId: number;
    code: string;
    displayName: string;
  })[];
};

const measure = (p: FunnelPoint): Measure => ({
  n: p.n,
  count: p.count,
  share: p.share,
  flag95: p.flag95,
  flag998: p.flag998,
});

/** n values at which the funnel limits are drawn: every n up to 40, then about 60 steps on a log scale. */
function limitGrid(maxN: number): number[] {
  const top = Math.max(40, Math.ceil(maxN * 1.15));
  const grid = new Set<number>();
  for (let n = 1; n <= Math.min(40, top); n++) grid.add(n);
  for (let k = 0; k <= 60; k++) grid.add(Math.round(40 * Math.pow(top / 40, k / 60)));
  return [...grid].sort((a, b) => a - b);
}

function limitRows(target: number | null, maxN: number): ClinicsResponse['limits']['responder'] {
  if (target === null || !(target > 0 && target < 1)) return [];
  return limitGrid(maxN).map((n) => {
    const l95 = funnelLimits(target, n, 0.95);
    const l998 = funnelLimits(target, n, 0.998);
    return { n, lower95: l95.lower, upper95: l95.upper, lower998: l998.lower, upper998: l998.upper };
  });
}

/** The one query of the peer comparison: every active clinic's episodes (consenting only for researchers). */
export function clinicsTupleOptions(ctx: AnalyticsContext): TupleOptions {
  return {
    cohort: { clinicId: null, consentingOnly: ctx.consentingOnly, activeClinicsOnly: true, filters: ctx.filters },
    ownClinicId: null,
    recovery: {
      instrumentId: ctx.recoveryInstrument.id,
      threshold: ctx.recoveryRule.threshold,
      atLeast: ctx.recoveryRule.direction === 'atLeast',
    },
    responder: { instrumentId: ctx.instrument.id, ...ctx.rules.rules.primaryWindow },
    facts: factsFor(ctx.filters),
    clinic: true,
  };
}

/** Peer comparison of active clinics on funnel plots (centre line: the pooled share of the clinics shown). */
export async function clinicFunnels(
  db: Db,
  ctx: AnalyticsContext,
  dataVersion: number,
): Promise<ClinicComparisonResult> {
  const rules = ctx.rules.rules;
  const week = rules.primaryWindow.targetWeek;
  const all = await loadEpisodeTuples(db, clinicsTupleOptions(ctx));
  const tuples = restrictToSubgroup(all, ctx.filters, ctx.instrument);
  const mcid = ctx.instrument.mcid;
  const opts = { higherIsBetter: ctx.instrument.higherIsBetter, threshold: mcid ?? 1, window: followUpWindow(rules) };
  const episodes: ClinicEpisode[] = tuples.map((t) => {
    const status = mcid === null ? null : classifyResponder(responderInput(t), opts).status;
    const obs = recoveryObs(t);
    return {
      clinic: String(t.clinic_id),
      responder: status === 'responder' ? true : status === 'non-responder' ? false : null,
      recoveredBy12: obs === null ? null : recoveredByWeek(obs, week),
    };
  });
  const minEpisodes = rules.minCellEstimate;
  // Small clinics are left out of the comparison altogether, centre line included.
  const counts = new Map<string, number>();
  for (const e of episodes) counts.set(e.clinic, (counts.get(e.clinic) ?? 0) + 1);
  const shown = episodes.filter((e) => (counts.get(e.clinic) ?? 0) >= minEpisodes);
  const report = clinicComparison(shown);
  const byId = new Map(ctx.allClinics.map((c) => [String(c.id), c]));
  const clinics = report.clinics.map((c) => {
    const info = byId.get(c.clinic);
    return {
      clinicId: Number(c.clinic),
      code: info?.code ?? '?',
      displayName: info?.name ?? '?',
      nEpisodes: c.nEpisodes,
      responder: measure(c.responder),
      recovered: measure(c.recoveredBy12),
    };
  });
  const maxOf = (f: (c: (typeof clinics)[number]) => number) => clinics.reduce((m, c) => Math.max(m, f(c)), 0);
  return {
    rulesVersion: ctx.rules.version,
    meta: metaOf(ctx, dataVersion),
    instrument: publicInstrument(ctx.instrument),
    targetWeek: week,
    centre: { responder: report.targets.responder, recovered: report.targets.recoveredBy12 },
    minEpisodes,
    hiddenSmall: [...counts.values()].filter((n) => n < minEpisodes).length,
    clinics,
    limits: {
      responder: limitRows(
        report.targets.responder,
        maxOf((c) => c.responder.n),
      ),
      recovered: limitRows(
        report.targets.recoveredBy12,
        maxOf((c) => c.recovered.n),
      ),
    },
  };
}

/**
 * What one viewer may see of the comparison, applied per request after the cache: the steward sees codes and
 * names; a lead sees their own clinic's code and fresh anonymous labels for the others; a researcher sees
 * anonymous labels only. Labels are shuffled on every request, so they cannot be matched across views.
 */
export function presentClinics(result: ClinicComparisonResult, scope: Scope): ClinicsResponse {
  const steward = scope.kind === 'registry' && !scope.researcher;
  const ownId = scope.kind === 'clinic' ? scope.clinicId : steward ? (result.meta.subject.clinicId ?? null) : null;
  const others = result.clinics.filter((c) => steward || c.clinicId !== ownId);
  const order = others.map((_, i) => i);
  for (let i = order.length - 1; i > 0; i--) {
    const j = randomInt(i + 1);
    [order[i], order[j]] = [order[j] as number, order[i] as number];
  }
  const width = String(others.length).length;
  const anonymous = new Map(
    others.map((c, i) => [c.clinicId, `Peer ${String((order[i] ?? 0) + 1).padStart(width, '0')}`]),
  );
  // Researchers: a count (or its complement) from 1 to k − 1 would let a small cell be worked out.
  const k = scope.kind === 'registry' && scope.researcher ? (result.meta.minCellShown ?? 0) : 0;
  const small = (x: number) => x > 0 && x < k;
  const guard = (m: Measure): Measure =>
    m.count !== null && (small(m.count) || small(m.n - m.count))
      ? { ...m, count: null, share: null, flag95: null, flag998: null }
      : m;
  const clinics = result.clinics
    .map(({ clinicId, code, displayName, ...rest }) => ({
      ...rest,
      responder: guard(rest.responder),
      recovered: guard(rest.recovered),
      label: steward ? code : clinicId === ownId ? `Your clinic (${code})` : (anonymous.get(clinicId) ?? 'Peer'),
      highlighted: clinicId === ownId,
      name: steward ? displayName : null,
    }))
    // Ordered by size, never by code, so the order gives nothing away.
    .sort((a, b) => a.nEpisodes - b.nEpisodes || a.label.localeCompare(b.label));
  return { ...result, clinics };
}
