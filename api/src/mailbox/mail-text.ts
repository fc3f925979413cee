/**
 * Reads a received message (RFC 5322 with MIME) into what the mailbox shows: subject, plain text and HTML.
 * Covers what mail programs send: folded headers, encoded words (RFC 2047), quoted-printable and base64
 * bodies, nested multipart. Bytes are decoded as UTF-8 at the end, whatever the charset says: good enough
 * for a development mailbox, not a general mail reader.
 */
export interface MailContent {
  subject: string;
  text: string;
  html: string | null;
}

type Headers = Map<string, string>;

function splitMessage(raw: string): { headers: Headers; body: string } {
  const match = /\r?\n\r?\n/.exec(raw);
  const head = match ? raw.slice(0, match.index) : raw;
  const body = match ? raw.slice(match.index + match[0].length) : '';
  const headers: Headers = new Map();
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    if (!headers.has(name)) headers.set(name, line.slice(colon + 1).trim());
  }
  return { headers, body };
}

/** Bytes held in a latin1 string (one char per byte) read as UTF-8. */
function utf8(bytes: string): string {
  return Buffer.from(bytes, 'latin1').toString('utf8');
}

function decodeQuotedPrintable(text: string): string {
  return text.replace(/=\r?\n/g, '').replace(/=([0-9A-Fa-f]{2})/g, (_m, hex: string) => String.fromCharCode(parseInt(hex, 16)));
}

/** RFC 2047 encoded words, e.g. `=?UTF-8?Q?Sweep_=E2=80=9Cx=E2=80=9D?=`; whitespace between two of them goes. */
export function decodeHeader(value: string): string {
  return value
    .replace(/(=\?[^?]+\?[QqBb]\?[^?]*\?=)\s+(?==\?)/g, '$1')
    .replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g, (_m, _charset: string, encoding: string, data: string) =>
      encoding.toUpperCase() === 'B' ? Buffer.from(data, 'base64').toString('utf8') : utf8(decodeQuotedPrintable(data.replace(/_/g, ' '))),
    );
}

function parameter(value: string, name: string): string | null {
  const match = new RegExp(`;\\s*${name}="?([^";]+)"?`, 'i').exec(value);
  return match ? match[1]! : null;
}

function decodeBody(headers: Headers, body: string): string {
  const encoding = (headers.get('content-transfer-encoding') ?? '7bit').toLowerCase();
  if (encoding === 'base64') return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
  if (encoding === 'quoted-printable') return utf8(decodeQuotedPrintable(body));
  return utf8(body);
}

function collect(headers: Headers, body: string, into: { text: string | null; html: string | null }): void {
  const type = (headers.get('content-type') ?? 'text/plain').toLowerCase();
  if (type.startsWith('multipart/')) {
    const boundary = parameter(headers.get('content-type')!, 'boundary');
    if (!boundary) return;
    const parts = body.split(`--${boundary}`).slice(1);
    for (const part of parts) {
      if (part.startsWith('--')) break;
      const inner = splitMessage(part.replace(/^\r?\n/, ''));
      collect(inner.headers, inner.body, into);
    }
    return;
  }
  if (type.startsWith('text/html')) into.html ??= decodeBody(headers, body);
  else if (type.startsWith('text/')) into.text ??= decodeBody(headers, body).replace(/\r\n/g, '\n').replace(/\n$/, '');
}

/** The subject and bodies of a raw message (read as latin1, one char per byte). */
export function readMailContent(raw: string): MailContent {
  const { headers, body } = splitMessage(raw);
  const found: { text: string | null; html: string | null } = { text: null, html: null };
  collect(headers, body, found);
  return { subject: decodeHeader(headers.get('subject') ?? ''), text: found.text ?? '', html: found.html };
}
