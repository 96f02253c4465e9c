/** A message as the fake SMTP server received and parsed it. */
export type ReceivedMail = {
  id: number;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string;
  /** Every http(s) link found in the text and HTML parts, in order, without duplicates. */
  links: string[];
  receivedAt: string;
};

const LIMIT = 200;
const shared: ReceivedMail[] = [];

/**
 * The process-wide outbox of the development fake SMTP server, read by GET /api/dev/outbox.
 * In memory on purpose: it exists only while `npm start` runs and holds nothing worth keeping.
 */
export const devOutbox = {
  add(m: ReceivedMail): void {
    shared.unshift(m);
    shared.length = Math.min(shared.length, LIMIT);
  },
  /** Newest first. */
  list(): ReceivedMail[] {
    return [...shared];
  },
  clear(): void {
    shared.length = 0;
  },
};

const LINK = /https?:\/\/[^\s<>"')]+/g;

export function linksIn(text: string, html: string): string[] {
  const hrefs = [...html.matchAll(/href="([^"]+)"/g)].map((m) => m[1]!.replaceAll('&amp;', '&'));
  const found = [...(text.match(LINK) ?? []), ...hrefs].filter((l) => /^https?:\/\//.test(l));
  return [...new Set(found)];
}
