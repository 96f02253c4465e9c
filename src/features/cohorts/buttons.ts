/** Button looks of the research screens: one filled action per view, quiet outlines for the rest. */
export const primaryButton =
  'rounded bg-accent px-4 py-2 text-sm font-medium text-white hover:bg-accent-strong disabled:cursor-not-allowed disabled:opacity-60';
export const quietButton =
  'rounded border border-line bg-surface px-3 py-1.5 text-sm text-ink hover:border-accent disabled:cursor-not-allowed disabled:text-ink-faint';
