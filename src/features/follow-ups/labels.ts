import type { FollowUpState, FollowUpTimepoint } from '../../../shared/follow-up-schedule';

// Our own words for the follow-up states (codes live in shared/follow-up-schedule.ts).

export const STATE_LABELS: Record<FollowUpState, string> = {
  upcoming: 'Not yet open',
  due: 'Open now',
  closing: 'Closes within a week',
  missed: 'Window passed',
  done: 'Recorded',
};

export const STATE_TONE: Record<FollowUpState, string> = {
  upcoming: 'bg-canvas text-ink-soft',
  due: 'bg-accent-tint text-accent-strong',
  closing: 'bg-caution/10 text-caution',
  missed: 'bg-bad/10 text-bad',
  done: 'bg-good/10 text-good',
};

export const FOLLOW_UP_LABELS: Record<FollowUpTimepoint, string> = {
  week6: 'Week 6',
  week12: 'Week 12',
  week26: 'Week 26',
};

/** "in 3 days", "today", "2 days ago" for a window's last day. */
export function daysLeftText(daysLeft: number): string {
  if (daysLeft === 0) return 'last day today';
  if (daysLeft === 1) return '1 day left';
  if (daysLeft > 1) return `${daysLeft} days left`;
  return `closed ${-daysLeft} day${daysLeft === -1 ? '' : 's'} ago`;
}
