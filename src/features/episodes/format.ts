/** A number with at most `digits` decimals, or a dash when missing. */
export function formatNumber(value: number | null | undefined, digits = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  return Number.isInteger(value) ? String(value) : value.toFixed(digits);
}

/** A sign-corrected change: "+3" means better, "−2" worse (true minus sign for legibility). */
export function formatChange(value: number | null | undefined, digits = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  const body = formatNumber(Math.abs(value), digits);
  if (value > 0) return `+${body}`;
  if (value < 0) return `−${body}`;
  return '0';
}

/** 'YYYY-MM-DD' shown as e.g. "3 Mar 2026", read as a calendar date (no time zone shift). */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '–';
  const d = new Date(`${iso}T00:00:00Z`);
  if (Number.isNaN(d.getTime())) return iso;
  return d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
}

/** Today as 'YYYY-MM-DD' in the browser's own calendar (the day the clinician sees). */
export function todayIso(now = new Date()): string {
  const m = String(now.getMonth() + 1).padStart(2, '0');
  const d = String(now.getDate()).padStart(2, '0');
  return `${now.getFullYear()}-${m}-${d}`;
}
