export interface MailTextPart {
  readonly text: string;
  /** Set when the text is a web address that should be a link. */
  readonly href?: string;
}

// http(s) only: a mail body must not turn into javascript: or data: links. Trailing punctuation
// is sentence, not address.
const WEB_ADDRESS = /https?:\/\/[^\s<>"]+[^\s<>".,;:!?)\]']/g;

/** Splits a plain-text mail body into text and links, so it can be shown without innerHTML. */
export function mailTextParts(body: string): MailTextPart[] {
  const parts: MailTextPart[] = [];
  let last = 0;
  for (const match of body.matchAll(WEB_ADDRESS)) {
    const start = match.index;
    if (start > last) parts.push({ text: body.slice(last, start) });
    parts.push({ text: match[0], href: match[0] });
    last = start + match[0].length;
  }
  if (last < body.length) parts.push({ text: body.slice(last) });
  return parts;
}
