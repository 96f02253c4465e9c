import type { Role } from '../../shared/roles';
import type { MailMessage } from './transport';

/**
 * The e-mails Loadline sends. They name the product and carry a link; never a person's health data,
 * never a clinic's results.
 */
const ROLE_WORDS: Record<Role, string> = {
  steward: 'registry steward',
  lead: 'clinic lead',
  clinician: 'clinician',
  researcher: 'researcher',
};

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function layout(title: string, paragraphs: string[], link: { href: string; label: string }, footer: string): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escape(p)}</p>`).join('');
  return `<!doctype html><html><body style="font-family:sans-serif;color:#1d2a2f;max-width:560px">
<h1 style="font-size:18px;color:#17545b">Loadline — ${escape(title)}</h1>${body}
<p style="margin:20px 0"><a href="${escape(link.href)}" style="background:#17545b;color:#fff;padding:10px 16px;border-radius:4px;text-decoration:none">${escape(link.label)}</a></p>
<p style="font-size:12px;color:#4a5a60">If the button does not work, copy this address into your browser: ${escape(link.href)}</p>
<p style="font-size:12px;color:#4a5a60">${escape(footer)}</p></body></html>`;
}

export function invitationMail(to: string, role: Role, clinicName: string | null, link: string): MailMessage {
  const where = clinicName ? ` for ${clinicName}` : '';
  const lines = [
    `You have been invited to Loadline, the heel-pain outcomes registry, as ${ROLE_WORDS[role]}${where}.`,
    'Open the link below to choose your name and password. The link works once and expires in 72 hours.',
  ];
  const footer =
    'If you did not expect this invitation, ignore this e-mail; no account is opened until the link is used.';
  return {
    to,
    subject: 'Your invitation to Loadline',
    text: `${lines.join('\n\n')}\n\n${link}\n\n${footer}\n\n— Loadline\n`,
    html: layout('your invitation', lines, { href: link, label: 'Set up my account' }, footer),
  };
}

export function resetMail(to: string, link: string): MailMessage {
  const lines = [
    'Someone asked to reset the password of your Loadline account.',
    'Open the link below to choose a new password. The link works once and expires in one hour. Choosing a new password signs your account out everywhere.',
  ];
  const footer = 'If you did not ask for this, ignore this e-mail; your password stays as it is.';
  return {
    to,
    subject: 'Reset your Loadline password',
    text: `${lines.join('\n\n')}\n\n${link}\n\n${footer}\n\n— Loadline\n`,
    html: layout('password reset', lines, { href: link, label: 'Choose a new password' }, footer),
  };
}
