import type { ReactNode } from 'react';

/** The narrow, centred frame of the sign-in, reset and invitation screens. */
export function AuthPanel({ title, lead, children }: { title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    <section className="mx-auto mt-4 max-w-md rounded-lg border border-line bg-surface px-8 py-8 shadow-sm">
      <p className="text-xs font-medium uppercase tracking-widest text-accent">Loadline registry</p>
      <h1 className="mt-1 text-2xl font-semibold text-ink">{title}</h1>
      {lead ? <div className="mt-2 text-sm text-ink-soft">{lead}</div> : null}
      <div className="mt-6">{children}</div>
    </section>
  );
}

/** A form-level message (the server's answer), announced when it appears. */
export function FormMessage({ tone, children }: { tone: 'bad' | 'good'; children: ReactNode }) {
  const look = tone === 'bad' ? 'border-bad/40 bg-bad/5 text-bad' : 'border-good/40 bg-good/5 text-good';
  return (
    <p role={tone === 'bad' ? 'alert' : 'status'} className={`rounded border px-3 py-2 text-sm ${look}`}>
      {children}
    </p>
  );
}

export const primaryButton =
  'w-full rounded bg-accent px-4 py-2 text-sm font-medium text-white hover:bg-accent-strong disabled:cursor-wait disabled:opacity-70';
