import type { AnalyticsContext } from './context';

/**
 * Small-cell suppression for researchers: a count from 1 to minCellResearcher − 1 becomes null (the client
 * shows "<k"); 0 and larger counts pass. Clinic teams and the steward see every count.
 */
export function suppressSmall(ctx: AnalyticsContext): (n: number) => number | null {
  if (!ctx.consentingOnly) return (n) => n;
  const k = ctx.rules.rules.minCellResearcher;
  return (n) => (n > 0 && n < k ? null : n);
}
