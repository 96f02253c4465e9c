import type { ClinicEpisode, ClinicReport } from './types';
import { funnelPoint } from './funnel-point';

/**
 * Clinic comparison on funnel plots.
 *
 * Per clinic: responder share and share recovered by 12 weeks, each with its
 * n, the exact binomial 95% and 99.8% funnel limits around a target
 * (Spiegelhalter 2005) and a flag above / within / below the limits (see
 * `funnelPoint`). The target defaults to the pooled share over all clinics
 * (the usual funnel-plot centre line); pass explicit targets to compare
 * against a benchmark instead. Episodes with a missing outcome are counted
 * per clinic and excluded from that measure. Clinics are sorted by name.
 *
 * Cost: O(n + Σ nᵢ) for n episodes (one CDF table per clinic and measure).
 *
 * @param episodes - clinic, responder status and recovered-by-12-weeks status. Not modified.
 * @param opts - optional targets in (0, 1).
 * @throws RangeError when a given target is not in (0, 1) or a clinic name is empty.
 * @returns the targets used and one row per clinic.
 * @example
 * clinicComparison(episodes, { responderTarget: 0.6 }).clinics[0].responder.flag998;
 */
export function clinicComparison(
  episodes: readonly ClinicEpisode[],
  opts: { responderTarget?: number; recoveryTarget?: number } = {},
): ClinicReport {
  for (const t of [opts.responderTarget, opts.recoveryTarget]) {
    if (t !== undefined && !(Number.isFinite(t) && t > 0 && t < 1)) {
      throw new RangeError(`clinicComparison: targets must be in (0, 1), got ${t}`);
    }
  }
  const byClinic = new Map<string, ClinicEpisode[]>();
  for (const e of episodes) {
    if (typeof e.clinic !== 'string' || e.clinic === '')
      throw new RangeError('clinicComparison: clinic must be a non-empty string');
    const list = byClinic.get(e.clinic);
    if (list) list.push(e);
    else byClinic.set(e.clinic, [e]);
  }
  const pooled = (values: (boolean | null)[]): number | null => {
    const known = values.filter((v): v is boolean => v !== null);
    return known.length > 0 ? known.filter(Boolean).length / known.length : null;
  };
  const responderTarget = opts.responderTarget ?? pooled(episodes.map((e) => e.responder));
  const recoveryTarget = opts.recoveryTarget ?? pooled(episodes.map((e) => e.recoveredBy12));
  const names = [...byClinic.keys()].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  return {
    targets: { responder: responderTarget, recoveredBy12: recoveryTarget },
    clinics: names.map((clinic) => {
      const list = byClinic.get(clinic) ?? [];
      return {
        clinic,
        nEpisodes: list.length,
        responder: funnelPoint(
          list.map((e) => e.responder),
          responderTarget,
        ),
        recoveredBy12: funnelPoint(
          list.map((e) => e.recoveredBy12),
          recoveryTarget,
        ),
      };
    }),
  };
}
