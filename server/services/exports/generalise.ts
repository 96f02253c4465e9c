import type { StartGranularity } from '../../../shared/export-columns';

/** The quasi-identifiers of one row as they would be exported. */
export type Qi = { ageBand: string; sex: string; bmiBand: string; activity: string; period: string; region: string };

const SEP = '\u001f';
/** One string per combination (made for every row of both passes, so a plain concatenation, no array). */
export const qiKey = (q: Qi) =>
  `${q.ageBand}${SEP}${q.sex}${SEP}${q.bmiBand}${SEP}${q.activity}${SEP}${q.period}${SEP}${q.region}`;

/** A 5-year band label ('40-44', '90+') widened to `width` years; the top code stays a top code. */
export function widenAgeBand(band: string, width: 10 | 20): string {
  const lower = Number.parseInt(band, 10);
  if (!Number.isFinite(lower)) return band;
  const top = width === 10 ? 90 : 80;
  const l = Math.floor(lower / width) * width;
  return l >= top ? `${top}+` : `${l}-${l + width - 1}`;
}

/** 'YYYY' or 'YYYY-Qn' from an ISO date: the only part of a date that ever leaves the server. */
export function startPeriod(isoDate: string, granularity: StartGranularity): string {
  const year = isoDate.slice(0, 4);
  if (granularity === 'year') return year;
  return `${year}-Q${Math.floor((Number(isoDate.slice(5, 7)) - 1) / 3) + 1}`;
}

/**
 * The generalisation ladder, coarsest last: age band to 10 then 20 years, start period to the year, BMI band to
 * '*', then region to '*'. Each level applies all the ones before it.
 */
const LEVELS: ((q: Qi) => Qi)[] = [
  (q) => q,
  (q) => ({ ...q, ageBand: widenAgeBand(q.ageBand, 10) }),
  (q) => ({ ...q, ageBand: widenAgeBand(q.ageBand, 20) }),
  (q) => ({ ...q, ageBand: widenAgeBand(q.ageBand, 20), period: q.period.slice(0, 4) }),
  (q) => ({ ...q, ageBand: widenAgeBand(q.ageBand, 20), period: q.period.slice(0, 4), bmiBand: '*' }),
  (q) => ({ ...q, ageBand: widenAgeBand(q.ageBand, 20), period: q.period.slice(0, 4), bmiBand: '*', region: '*' }),
];
export const generalise = (q: Qi, level: number): Qi => LEVELS[level]!(q);

export type Plan = {
  /** Level to export each original combination at, or 'suppress'. Keyed by `qiKey` of the ungeneralised values. */
  decision: Map<string, number | 'suppress'>;
  generalisedRows: number;
  suppressedRows: number;
  keptRows: number;
};

type Entry = { key: string; qi: Qi; n: number };

/**
 * Decides, from the count of every original quasi-identifier combination, how each is exported so that every
 * combination in the file is shared by at least k rows (k-anonymity, Sweeney 2002). Memory is one entry per
 * distinct combination, never per row.
 *
 * Combinations with k or more rows stay as they are. The rest climb the ladder together; at each level, those
 * whose generalised combination now reaches k rows (counting only rows still climbing) settle there. A settled
 * group is never split or shrunk afterwards, and two groups that end with the same exported values only make a
 * larger class, so every class in the file keeps at least k rows. What never reaches k is suppressed.
 */
export function planGeneralisation(counts: ReadonlyMap<string, { qi: Qi; n: number }>, k: number): Plan {
  const decision = new Map<string, number | 'suppress'>();
  let open: Entry[] = [...counts.entries()].map(([key, v]) => ({ key, qi: v.qi, n: v.n }));
  let generalisedRows = 0;
  let keptRows = 0;
  for (let level = 0; level < LEVELS.length && open.length > 0; level++) {
    const keyed = open.map((e) => ({ e, gkey: qiKey(generalise(e.qi, level)) }));
    const tally = new Map<string, number>();
    for (const { e, gkey } of keyed) tally.set(gkey, (tally.get(gkey) ?? 0) + e.n);
    const still: Entry[] = [];
    for (const { e, gkey } of keyed) {
      if ((tally.get(gkey) ?? 0) < k) {
        still.push(e);
        continue;
      }
      decision.set(e.key, level);
      keptRows += e.n;
      if (gkey !== e.key) generalisedRows += e.n;
    }
    open = still;
  }
  let suppressedRows = 0;
  for (const e of open) {
    decision.set(e.key, 'suppress');
    suppressedRows += e.n;
  }
  return { decision, generalisedRows, suppressedRows, keptRows };
}
