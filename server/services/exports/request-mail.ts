import { env } from '../../env';
import type { MailMessage } from '../../mail/transport';

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The data-requests screen, for the link in the e-mail. */
function requestsLink(): string {
  const e = env();
  return new URL('/data-requests', e.APP_URL ?? `http://${e.HOST}:${e.PORT}`).toString();
}

export type Decision =
  | { kind: 'approved'; expiresOn: string; startGranularity: string; allowRawBmi: boolean; k: number }
  | { kind: 'declined'; reason: string };

/**
 * The decision e-mail, sent to the requester and to the steward who decided. It names the request and the
 * conditions only: no counts, no data.
 */
export function decisionMail(to: string, requestId: number, cohortName: string, d: Decision): MailMessage {
  const subject = `Loadline data request #${requestId} ${d.kind}`;
  const lines =
    d.kind === 'approved'
      ? [
          `Data request #${requestId} for the cohort "${cohortName}" has been approved.`,
          `The requester can download the de-identified export until ${d.expiresOn} (inclusive). Start dates are reduced to the ${d.startGranularity}; every combination of quasi-identifiers is shared by at least ${d.k} rows; raw BMI is ${d.allowRawBmi ? 'included' : 'not included'}.`,
        ]
      : [
          `Data request #${requestId} for the cohort "${cohortName}" has been declined.`,
          `Reason given by the registry steward: ${d.reason}`,
        ];
  const link = requestsLink();
  const footer = 'Use registry data only for the purpose stated in the request, and never try to re-identify anyone.';
  return {
    to,
    subject,
    text: `${lines.join('\n\n')}\n\n${link}\n\n${footer}\n\n— Loadline\n`,
    html: `<!doctype html><html><body style="font-family:sans-serif;color:#1d2a2f;max-width:560px">
<h1 style="font-size:18px;color:#17545b">Loadline — ${escape(subject)}</h1>
${lines.map((l) => `<p style="margin:0 0 12px">${escape(l)}</p>`).join('')}
<p><a href="${escape(link)}">Open data requests</a></p>
<p style="font-size:12px;color:#4a5a60">${escape(footer)}</p></body></html>`,
  };
}
