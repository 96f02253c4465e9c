/** Number and date words of the console screens. */

const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });
const dateOnly = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone: 'UTC' });

/** A moment as "3 Mar 2026, 10:00 UTC"; the console shows UTC, like the audit trail's date filter. */
export const formatWhen = (iso: string | null) => (iso ? `${dateTime.format(new Date(iso))} UTC` : '—');
export const formatDay = (iso: string | null) => (iso ? dateOnly.format(new Date(iso)) : '—');

export const formatShare = (share: number | null) => (share === null ? '—' : `${Math.round(share * 100)}%`);

export const formatRange = (min: number, max: number) =>
  `${min < 0 ? `−${-min}` : min} to ${max < 0 ? `−${-max}` : max}`;
