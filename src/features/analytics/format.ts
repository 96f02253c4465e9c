import type { Interval } from '../../../shared/schemas/analytics';

/** Number formats of the dashboards: whole percentages, one decimal for weeks, p-values in the usual style. */
const pctFmt = new Intl.NumberFormat('en', { style: 'percent', maximumFractionDigits: 0 });
const oneDp = new Intl.NumberFormat('en', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const twoDp = new Intl.NumberFormat('en', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const intFmt = new Intl.NumberFormat('en');

export const DASH = '–';

export const pct = (v: number | null | undefined) => (v === null || v === undefined ? DASH : pctFmt.format(v));
export const weeks = (v: number | null | undefined) =>
  v === null || v === undefined ? 'not reached' : oneDp.format(v);
export const ratio = (v: number | null | undefined) => (v === null || v === undefined ? DASH : twoDp.format(v));
export const int = (v: number | null | undefined) => (v === null || v === undefined ? DASH : intFmt.format(v));
export const dec1 = (v: number | null | undefined) => (v === null || v === undefined ? DASH : oneDp.format(v));

/** A hidden small count for researchers reads "<k". */
export const count = (v: number | null, minShown: number | null) =>
  v === null ? (minShown ? `<${minShown}` : DASH) : intFmt.format(v);

export function pctInterval(i: Interval | null | undefined): string {
  if (!i || i.lower === null || i.upper === null) return DASH;
  return `${pct(i.lower)} to ${pct(i.upper)}`;
}

export function weeksInterval(i: Interval | null | undefined): string {
  if (!i) return DASH;
  return `${i.lower === null ? 'not reached' : oneDp.format(i.lower)} to ${i.upper === null ? 'not reached' : oneDp.format(i.upper)}`;
}

export function pValue(p: number | null | undefined): string {
  if (p === null || p === undefined) return DASH;
  if (p < 0.001) return '<0.001';
  return p < 0.01 ? p.toFixed(3) : p.toFixed(2);
}

export function dateTime(iso: string | null): string {
  if (!iso) return DASH;
  return new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
}
