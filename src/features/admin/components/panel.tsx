import type { ReactNode } from 'react';

/** A bordered panel with a heading, for forms and small lists inside a console screen. */
export function Panel({ title, children, aside }: { title: string; children: ReactNode; aside?: ReactNode }) {
  return (
    <section className="space-y-4 rounded border border-line bg-surface p-5" aria-label={title}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-base font-semibold">{title}</h2>
        {aside}
      </div>
      {children}
    </section>
  );
}

/** A saved change said once, politely, to screen readers too. */
export function SavedNote({ children }: { children: ReactNode }) {
  return (
    <p role="status" className="text-sm text-good">
      {children}
    </p>
  );
}
