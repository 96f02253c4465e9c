import { summariseChange, summariseRecoveryCurve, wilsonInterval, type Obs } from '../../../analysis';
import type { OutcomeSummary } from '../../../shared/schemas/cohort';
import type { RegistryRules } from '../../../shared/rules';
import type { EpisodeFacts } from './derive';
import type { Reference } from './reference';
import type { Suppress } from './small-cells';

type Pairs = { baseline: number; followUp: number }[];

/** Week marks of the recovery summary (the scheduled follow-ups). */
const RECOVERY_WEEKS = [6, 12, 26];

/**
 * Collects what the cohort's outcome summary needs while the episodes stream past (pairs per instrument,
 * responders, recovery observations), then asks the outcomes engine for the numbers.
 */
export function summaryAccumulator(ref: Reference) {
  const pairs = new Map<string, Pairs>(ref.instruments.map((i) => [i.code, []]));
  const responders = new Map<string, number>(ref.instruments.map((i) => [i.code, 0]));
  const recovery: Obs[] = [];
  return {
    add(f: EpisodeFacts) {
      for (const [code, facts] of f.byInstrument) {
        if (facts.baseline === null || facts.followUp === null) continue;
        pairs.get(code)?.push({ baseline: facts.baseline, followUp: facts.followUp });
        if (facts.responder) responders.set(code, (responders.get(code) ?? 0) + 1);
      }
      if (f.recovery) recovery.push(f.recovery);
    },
    finish(rules: RegistryRules, s: Suppress): OutcomeSummary {
      const minEstimate = rules.minCellEstimate;
      const instruments = ref.instruments
        .filter((i) => !i.retired)
        .map((i) => {
          const p = pairs.get(i.code) ?? [];
          const n = p.length;
          const r = responders.get(i.code) ?? 0;
          const enough = n >= minEstimate;
          const c = enough ? summariseChange(p, { higherIsBetter: i.higherIsBetter }) : null;
          // A share would give a hidden count away (share × n), so it is hidden with it.
          const shareShown = enough && i.mcid !== null && !s.small(r) && !s.small(n - r);
          return {
            code: i.code,
            label: i.label,
            unit: i.unit,
            higherIsBetter: i.higherIsBetter,
            mcid: i.mcid,
            nPaired: s.cell(n),
            change: c && {
              mean: c.meanChange,
              lower: c.meanChangeCi?.lower ?? null,
              upper: c.meanChangeCi?.upper ?? null,
              median: c.median,
              q1: c.q1,
              q3: c.q3,
            },
            responders: shareShown ? { count: s.cell(r), share: wilsonInterval(r, n, 0.95) } : null,
          };
        });
      const n = recovery.length;
      const curve = n >= minEstimate ? summariseRecoveryCurve(recovery, { weeks: RECOVERY_WEEKS }) : null;
      return {
        minEstimate,
        instruments,
        recovery: curve && {
          instrumentCode: rules.recovery.instrumentCode,
          threshold: rules.recovery.threshold,
          n: s.cell(curve.n),
          recovered: s.cell(curve.recovered),
          atWeeks: curve.atWeeks,
          medianWeeks: curve.medianWeeks,
        },
      };
    },
  };
}
