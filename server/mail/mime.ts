/**
 * Just enough MIME reading for the fake inbox: our own messages are sent with base64 or
 * quoted-printable parts in multipart/alternative, with RFC 2047 encoded-word subjects.
 */
export interface ReadMessage {
  headers: Map<string, string>;
  text: string;
  html: string;
}

function splitHeaders(raw: string): { headers: Map<string, string>; body: string } {
  const end = raw.search(/\r?\n\r?\n/);
  const head = end < 0 ? raw : raw.slice(0, end);
  const body = end < 0 ? '' : raw.slice(end).replace(/^\r?\n\r?\n/, '');
  const headers = new Map<string, string>();
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const i = line.indexOf(':');
    if (i > 0) headers.set(line.slice(0, i).trim().toLowerCase(), line.slice(i + 1).trim());
  }
  return { headers, body };
}

function decodeQuotedPrintable(s: string): Buffer {
  const soft = s.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < soft.length; i++) {
    const c = soft[i]!;
    if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(soft.slice(i + 1, i + 3))) {
      bytes.push(parseInt(soft.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(c, 'utf8'));
    }
  }
  return Buffer.from(bytes);
}

function decodeBody(body: string, encoding: string | undefined): string {
  switch ((encoding ?? '7bit').toLowerCase()) {
    case 'base64':
      return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
    case 'quoted-printable':
      return decodeQuotedPrintable(body).toString('utf8');
    default:
      return body;
  }
}

/** Decodes RFC 2047 encoded words (`=?UTF-8?B?…?=`, `=?UTF-8?Q?…?=`). */
export function decodeWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(
      /=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g,
      (_m, _charset: string, enc: string, text: string) =>
        enc.toUpperCase() === 'B'
          ? Buffer.from(text, 'base64').toString('utf8')
          : decodeQuotedPrintable(text.replace(/_/g, ' ')).toString('utf8'),
    );
}

function walk(raw: string, out: { text: string; html: string }) {
  const { headers, body } = splitHeaders(raw);
  const type = headers.get('content-type') ?? 'text/plain';
  const boundary = /boundary="?([^";]+)"?/i.exec(type)?.[1];
  if (/^multipart\//i.test(type) && boundary) {
    const parts = body.split(`--${boundary}`).slice(1);
    for (const part of parts) {
      if (part.startsWith('--')) break;
      walk(part.replace(/^\r?\n/, ''), out);
    }
    return;
  }
  const decoded = decodeBody(body, headers.get('content-transfer-encoding')).replace(/\r?\n$/, '');
  if (/^text\/html/i.test(type)) out.html ||= decoded;
  else if (/^text\/plain/i.test(type)) out.text ||= decoded;
}

export function readMessage(raw: string): ReadMessage {
  const { headers } = splitHeaders(raw);
  const out = { text: '', html: '' };
  walk(raw, out);
  return { headers, ...out };
}
