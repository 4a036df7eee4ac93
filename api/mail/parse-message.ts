/** The parts of an Internet message the outbox shows. */
export interface ParsedMessage {
  subject: string;
  text: string;
}

interface Part {
  headers: Map<string, string>;
  body: Buffer;
}

function splitPart(raw: Buffer): Part {
  const source = raw.toString('latin1');
  const match = /\r?\n\r?\n/.exec(source);
  const headEnd = match ? match.index : source.length;
  const bodyStart = match ? match.index + match[0].length : source.length;
  const headers = new Map<string, string>();
  // Folded header lines continue with whitespace (RFC 5322 §2.2.3).
  const unfolded = source.slice(0, headEnd).replace(/\r?\n(?=[ \t])/g, '');
  for (const line of unfolded.split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  return { headers, body: Buffer.from(source.slice(bodyStart), 'latin1') };
}

function parameter(header: string | undefined, name: string): string | undefined {
  const match = new RegExp(`;\\s*${name}\\s*=\\s*(?:"([^"]*)"|([^;\\s]+))`, 'i').exec(header ?? '');
  return match ? (match[1] ?? match[2]) : undefined;
}

function decodeCharset(bytes: Buffer, charset: string | undefined): string {
  try {
    return new TextDecoder(charset ?? 'utf-8').decode(bytes);
  } catch {
    return new TextDecoder('utf-8').decode(bytes);
  }
}

/** Quoted-printable (RFC 2045 §6.7): soft line breaks vanish, `=XX` is one byte. */
function decodeQuotedPrintable(text: string): Buffer {
  const bytes: number[] = [];
  const source = text.replace(/=\r?\n/g, '');
  for (let i = 0; i < source.length; i++) {
    const hex = source.slice(i + 1, i + 3);
    if (source[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(source.charCodeAt(i) & 0xff);
    }
  }
  return Buffer.from(bytes);
}

function decodeBody(part: Part): string {
  const encoding = (part.headers.get('content-transfer-encoding') ?? '7bit').toLowerCase();
  const charset = parameter(part.headers.get('content-type'), 'charset');
  let bytes = part.body;
  if (encoding === 'base64') bytes = Buffer.from(bytes.toString('latin1').replace(/\s+/g, ''), 'base64');
  else if (encoding === 'quoted-printable') bytes = decodeQuotedPrintable(bytes.toString('latin1'));
  // Transports end the body with a line break of their own; the text did not have it.
  return decodeCharset(bytes, charset).replace(/\r\n/g, '\n').replace(/\n$/, '');
}

/** Encoded words in headers (RFC 2047): `=?utf-8?Q?...?=` and `=?utf-8?B?...?=`. */
export function decodeEncodedWords(value: string): string {
  const joined = value.replace(/(\?=)\s+(=\?)/g, '$1$2');
  return joined.replace(
    /=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g,
    (_all, charset: string, kind: string, data: string) => {
      const bytes =
        kind.toUpperCase() === 'B'
          ? Buffer.from(data, 'base64')
          : decodeQuotedPrintable(data.replace(/_/g, ' '));
      return decodeCharset(bytes, charset.replace(/\*.*$/, ''));
    },
  );
}

function firstTextPart(part: Part, depth: number): string | null {
  const type = (part.headers.get('content-type') ?? 'text/plain').toLowerCase();
  if (type.startsWith('text/plain')) return decodeBody(part);
  const boundary = parameter(part.headers.get('content-type'), 'boundary');
  if (!type.startsWith('multipart/') || !boundary || depth > 4) return null;
  const source = part.body.toString('latin1');
  const pieces = source.split(
    new RegExp(`\\r?\\n?--${boundary.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(?:--)?[ \\t]*\\r?\\n?`),
  );
  for (const piece of pieces.slice(1)) {
    if (piece.trim() === '') continue;
    const text = firstTextPart(splitPart(Buffer.from(piece, 'latin1')), depth + 1);
    if (text !== null) return text;
  }
  return null;
}

/**
 * Reads the subject and the plain-text body of a message as an SMTP server receives it (after the
 * transport's dot-unstuffing). Enough for the development outbox, not a general MIME parser: it takes
 * the first `text/plain` part and ignores attachments.
 */
export function parseMessage(raw: Buffer): ParsedMessage {
  const root = splitPart(raw);
  return {
    // Raw UTF-8 in a header (SMTPUTF8) was read as latin1 above; encoded words are ASCII either way.
    subject: decodeEncodedWords(Buffer.from(root.headers.get('subject') ?? '', 'latin1').toString('utf8')),
    text: firstTextPart(root, 0) ?? '',
  };
}
