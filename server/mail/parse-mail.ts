/** The parts of a message the dev mailbox shows. */
export interface ParsedMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  date?: string;
}

interface Part {
  headers: Map<string, string>;
  body: string;
}

function splitPart(raw: string): Part {
  const at = raw.search(/\r?\n\r?\n/);
  const head = at < 0 ? raw : raw.slice(0, at);
  const body = at < 0 ? '' : raw.slice(at).replace(/^\r?\n\r?\n/, '');
  const headers = new Map<string, string>();
  // Folded header lines continue with leading whitespace (RFC 5322 §2.2.3).
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  return { headers, body };
}

function param(header: string | undefined, name: string): string | undefined {
  const m = header?.match(new RegExp(`${name}="?([^";]+)"?`, 'i'));
  return m?.[1];
}

function decodeQuotedPrintable(text: string): Uint8Array {
  const bytes: number[] = [];
  const s = text.replace(/=\r?\n/g, '');
  for (let i = 0; i < s.length; i++) {
    if (s[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(s.slice(i + 1, i + 3))) {
      bytes.push(parseInt(s.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      bytes.push(...new TextEncoder().encode(s[i]));
    }
  }
  return Uint8Array.from(bytes);
}

function decodeBody(part: Part): string {
  const encoding = (part.headers.get('content-transfer-encoding') ?? '7bit').toLowerCase();
  if (encoding === 'base64') return Buffer.from(part.body.replace(/\s+/g, ''), 'base64').toString('utf8');
  if (encoding === 'quoted-printable') return new TextDecoder().decode(decodeQuotedPrintable(part.body));
  return part.body;
}

/** Decodes RFC 2047 encoded words such as `=?UTF-8?Q?Reset_your_password?=` (UTF-8 only). */
function decodeWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_all, _charset: string, kind: string, data: string) =>
      kind.toUpperCase() === 'B'
        ? Buffer.from(data, 'base64').toString('utf8')
        : new TextDecoder().decode(decodeQuotedPrintable(data.replace(/_/g, ' '))));
}

function collect(part: Part, out: { text?: string; html?: string }): void {
  const type = (part.headers.get('content-type') ?? 'text/plain').toLowerCase();
  if (type.startsWith('multipart/')) {
    const boundary = param(part.headers.get('content-type'), 'boundary');
    if (!boundary) return;
    const pieces = part.body.split(`--${boundary}`).slice(1);
    for (const piece of pieces) {
      if (piece.startsWith('--')) break;
      collect(splitPart(piece.replace(/^\r?\n/, '')), out);
    }
  } else if (type.startsWith('text/html')) {
    out.html ??= decodeBody(part).replace(/\r?\n$/, '');
  } else if (type.startsWith('text/plain')) {
    out.text ??= decodeBody(part).replace(/\r?\n$/, '');
  }
}

/**
 * A small MIME reader, enough for the mails this app sends (text and HTML parts in base64,
 * quoted-printable or 7bit). Source for the format: RFC 2045–2047 (from memory).
 */
export function parseMail(raw: string): ParsedMail {
  const root = splitPart(raw);
  const out: { text?: string; html?: string } = {};
  collect(root, out);
  return {
    to: decodeWords(root.headers.get('to') ?? ''),
    subject: decodeWords(root.headers.get('subject') ?? ''),
    text: out.text ?? '',
    ...(out.html === undefined ? {} : { html: out.html }),
    ...(root.headers.has('date') ? { date: root.headers.get('date') } : {}),
  };
}
