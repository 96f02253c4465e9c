import type { EPISODE_STATUSES } from '../../../shared/constants';

const TONE: Record<(typeof EPISODE_STATUSES)[number], string> = {
  open: 'bg-accent-tint text-accent-strong',
  discharged: 'bg-canvas text-ink-soft',
  lost: 'bg-caution/10 text-caution',
};

/** An episode's status as a quiet pill (the word carries the meaning, the tint only supports it). */
export function StatusBadge({ status, label }: { status: (typeof EPISODE_STATUSES)[number]; label: string }) {
  return <span className={`inline-block rounded-full px-2 py-0.5 text-xs ${TONE[status]}`}>{label}</span>;
}
