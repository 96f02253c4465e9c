import type { FollowUpItem } from '../../shared/schemas/follow-ups';
import type { MailMessage } from '../mail/transport';

const TIMEPOINT_WORDS = { week6: 'week 6', week12: 'week 12', week26: 'week 26' } as const;

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

type DigestItem = Pick<FollowUpItem, 'reference' | 'timepoint' | 'state' | 'closesOn'>;

/** How many to list by name; the rest are counted (a long list belongs on the screen, not in a mailbox). */
const LISTED = 25;

/**
 * The daily digest: counts and the clinic's own episode references only. Never a score, a pseudonym or anything
 * about the patient beyond "a follow-up is due".
 */
export function digestMail(
  to: string,
  clinicName: string,
  day: string,
  items: readonly DigestItem[],
  screenUrl: string,
  settingsNote: string,
): MailMessage {
  const closing = items.filter((i) => i.state === 'closing');
  const due = items.filter((i) => i.state === 'due');
  const summary = `${clinicName}: ${closing.length} follow-up${closing.length === 1 ? '' : 's'} closing within 7 days and ${due.length} more due (${day}).`;
  const ordered = [...closing, ...due].sort((a, b) => a.closesOn.localeCompare(b.closesOn));
  const lines = ordered
    .slice(0, LISTED)
    .map(
      (i) =>
        `${i.reference}, ${TIMEPOINT_WORDS[i.timepoint]}, window closes ${i.closesOn}${i.state === 'closing' ? ' (closing)' : ''}`,
    );
  const more = ordered.length > LISTED ? `… and ${ordered.length - LISTED} more on the follow-ups screen.` : '';
  const text = [
    summary,
    '',
    ...lines.map((l) => `- ${l}`),
    more,
    '',
    `Open the follow-ups screen: ${screenUrl}`,
    '',
    settingsNote,
    '',
    '— Loadline',
    '',
  ]
    .filter((l, idx, all) => !(l === '' && all[idx - 1] === ''))
    .join('\n');
  const html = `<!doctype html><html><body style="font-family:sans-serif;color:#1d2a2f;max-width:560px">
<h1 style="font-size:18px;color:#17545b">Loadline — follow-ups to record</h1>
<p>${escape(summary)}</p>
<ul>${lines.map((l) => `<li>${escape(l)}</li>`).join('')}</ul>${more ? `<p>${escape(more)}</p>` : ''}
<p><a href="${escape(screenUrl)}" style="color:#17545b">Open the follow-ups screen</a></p>
<p style="font-size:12px;color:#4a5a60">${escape(settingsNote)}</p></body></html>`;
  const n = closing.length + due.length;
  return { to, subject: `Loadline: ${n} follow-up${n === 1 ? '' : 's'} to record`, text, html };
}
