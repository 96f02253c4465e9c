import type { CountCell } from '../../../shared/schemas/cohort';

const intFmt = new Intl.NumberFormat('en');
const oneDp = new Intl.NumberFormat('en', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const pctFmt = new Intl.NumberFormat('en', { style: 'percent', maximumFractionDigits: 0 });

export const DASH = '–';

/**
 * A count as the server sent it: a number; "<k" when it is a small cell hidden from researchers; or
 * "hidden" when it is withheld so that a small cell elsewhere in the table cannot be worked out.
 */
export const countText = (c: CountCell) =>
  typeof c === 'number' ? intFmt.format(c) : c === 'hidden' ? 'withheld' : c.replace('<', 'fewer than ');
export const countShort = (c: CountCell) =>
  typeof c === 'number' ? intFmt.format(c) : c === 'hidden' ? 'withheld' : c;
export const dec1 = (v: number | null | undefined) => (v === null || v === undefined ? DASH : oneDp.format(v));
export const pct = (v: number | null | undefined) => (v === null || v === undefined ? DASH : pctFmt.format(v));

export function signed(v: number): string {
  return v > 0 ? `+${intFmt.format(v)}` : intFmt.format(v);
}

export function savedWhen(iso: string): string {
  return new Intl.DateTimeFormat('en', { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(iso));
}
