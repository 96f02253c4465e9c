/** The console's button looks: one filled accent action per view, quiet outlines for the rest. */
export const primaryButton =
  'rounded bg-accent px-4 py-2 text-sm font-medium text-white hover:bg-accent-strong disabled:cursor-not-allowed disabled:opacity-60';
export const quietButton =
  'rounded border border-line bg-surface px-3 py-1.5 text-sm text-ink hover:border-accent disabled:cursor-not-allowed disabled:text-ink-faint';
export const dangerButton =
  'rounded border border-bad/50 bg-surface px-3 py-1.5 text-sm text-bad hover:bg-bad/5 disabled:cursor-not-allowed disabled:opacity-60';
export const linkButton = 'text-sm text-accent underline-offset-2 hover:underline disabled:text-ink-faint';
