/** A run of message text: plain words, or a link the console may make clickable. */
export interface TextPart {
  text: string;
  href?: string;
}

const URL_PATTERN = /https?:\/\/[^\s<>"')\]]+/g;

/**
 * Splits an e-mail's text into plain parts and links. Only http(s) links become clickable, and a
 * link to this console's own origin is turned into a path so it opens inside the console.
 */
export function splitLinks(text: string, consoleOrigin?: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0;
    const url = match[0].replace(/[.,;:!?]+$/, '');
    if (start > last) parts.push({ text: text.slice(last, start) });
    let href = url;
    if (consoleOrigin && url.startsWith(consoleOrigin + '/')) href = url.slice(consoleOrigin.length);
    parts.push({ text: url, href });
    last = start + url.length;
  }
  if (last < text.length) parts.push({ text: text.slice(last) });
  return parts;
}

/** Recipients as one line. */
export function recipients(to: string | string[]): string {
  return Array.isArray(to) ? to.join(', ') : to;
}
