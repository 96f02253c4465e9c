/** A designed loading state: a quiet line of text, announced to screen readers. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" aria-live="polite" className="animate-pulse py-8 text-sm text-ink-faint">
      {label}
    </p>
  );
}
