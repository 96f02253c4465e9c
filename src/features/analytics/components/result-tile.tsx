import { useId, type ReactNode } from 'react';

export type Position = 'above' | 'within' | 'below' | null;

const POSITION_WORDS: Record<Exclude<Position, null>, string> = {
  above: 'Above the expectation',
  within: 'Compatible with the expectation',
  below: 'Below the expectation',
};
const POSITION_STYLE: Record<Exclude<Position, null>, string> = {
  above: 'border-good/40 bg-good/10 text-good',
  within: 'border-line bg-canvas text-ink-soft',
  below: 'border-bad/40 bg-bad/5 text-bad',
};

/** Where an interval lies against a target, in words (colour is never the only signal). */
export function PositionBadge({ position }: { position: Position }) {
  if (!position) return null;
  return (
    <span className={`inline-block rounded border px-2 py-0.5 text-xs ${POSITION_STYLE[position]}`}>
      {POSITION_WORDS[position]}
    </span>
  );
}

/** A small "i" that shows its text on hover and on keyboard focus (and to screen readers at once). */
export function InfoTip({ children, label = 'About this number' }: { children: ReactNode; label?: string }) {
  const id = useId();
  return (
    <span className="group relative inline-block align-middle">
      <button
        type="button"
        aria-label={label}
        aria-describedby={id}
        className="ml-1 h-4 w-4 rounded-full border border-line text-[10px] leading-none text-ink-soft hover:border-accent hover:text-accent"
      >
        i
      </button>
      <span
        id={id}
        role="tooltip"
        className="absolute -left-24 top-6 z-10 hidden w-72 max-w-[80vw] rounded border border-line bg-surface p-3 text-xs font-normal normal-case leading-relaxed tracking-normal text-ink shadow-sm group-focus-within:block group-hover:block"
      >
        {children}
      </span>
    </span>
  );
}

/** One headline figure of the clinic results. */
export function ResultTile({
  label,
  value,
  detail,
  info,
  badge,
  testId,
}: {
  label: string;
  value: ReactNode;
  detail?: ReactNode;
  info?: ReactNode;
  badge?: ReactNode;
  testId?: string;
}) {
  return (
    <div className="flex flex-col gap-1 rounded border border-line bg-surface px-4 py-4" data-testid={testId}>
      <dt className="text-xs uppercase tracking-wide text-ink-faint">
        {label}
        {info ? <InfoTip>{info}</InfoTip> : null}
      </dt>
      <dd className="tabular text-2xl font-medium text-ink">{value}</dd>
      {detail ? <dd className="tabular text-xs text-ink-soft">{detail}</dd> : null}
      {badge ? <dd>{badge}</dd> : null}
    </div>
  );
}
