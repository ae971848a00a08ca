// Splits a plain-text mail into text and web addresses, so the local mailbox can show links people can tap
// (an invitation, a job) instead of text to copy. Only http(s) addresses become links.
type MailPart = { text: string; href?: string };

const URL_RE = /https?:\/\/[^\s<>"']+/g;
// Sentence punctuation right after an address belongs to the sentence, not the address.
const TRAILING = /[.,;:!?)\]]+$/;

export function splitMailLinks(body: string): MailPart[] {
  const parts: MailPart[] = [];
  let last = 0;
  for (const m of body.matchAll(URL_RE)) {
    const raw = m[0];
    const href = raw.replace(TRAILING, "");
    const start = m.index;
    if (start > last) parts.push({ text: body.slice(last, start) });
    parts.push({ text: href, href });
    last = start + href.length;
  }
  if (last < body.length) parts.push({ text: body.slice(last) });
  return parts;
}
