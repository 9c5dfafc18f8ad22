/**
 * Just enough of RFC 5322 / RFC 2045–2047 / RFC 2231 to show what the local mailbox received: the
 * headers, the plain-text body and the names of the attachments.
 */
export interface ParsedMail {
  from: string;
  to: string[];
  subject: string;
  date: string | null;
  text: string;
  attachments: { filename: string; contentType: string; sizeBytes: number }[];
}

interface HeaderValue {
  value: string;
  params: Map<string, string>;
}

type Headers = Map<string, string>;

interface Found {
  text: string | null;
  html: string | null;
  attachments: ParsedMail['attachments'];
}

export function parseMail(raw: Buffer): ParsedMail {
  const { headers, body } = splitPart(raw);
  const found: Found = { text: null, html: null, attachments: [] };
  walk(headers, body, found);
  const date = headers.get('date');
  return {
    from: decodeWords(headers.get('from') ?? ''),
    to: splitAddresses(decodeWords([headers.get('to'), headers.get('cc')].filter(Boolean).join(', '))),
    subject: decodeWords(headers.get('subject') ?? ''),
    date: date && !Number.isNaN(Date.parse(date)) ? new Date(date).toISOString() : null,
    text: found.text ?? (found.html === null ? '' : htmlToText(found.html)),
    attachments: found.attachments,
  };
}

function walk(headers: Headers, body: Buffer, found: Found): void {
  const type = parseHeaderValue(headers.get('content-type') ?? 'text/plain');
  const boundary = type.params.get('boundary');
  if (type.value.startsWith('multipart/') && boundary) {
    for (const part of splitMultipart(body, boundary)) {
      const inner = splitPart(part);
      walk(inner.headers, inner.body, found);
    }
    return;
  }
  collect(headers, body, found);
}

function collect(headers: Headers, body: Buffer, found: Found): void {
  const type = parseHeaderValue(headers.get('content-type') ?? 'text/plain');
  const disposition = parseHeaderValue(headers.get('content-disposition') ?? '');
  const content = decodeTransfer(body, headers.get('content-transfer-encoding'));
  const filename = disposition.params.get('filename') ?? type.params.get('name');
  if (filename !== undefined || disposition.value === 'attachment') {
    found.attachments.push({
      filename: filename ?? 'attachment',
      contentType: type.value,
      sizeBytes: content.length,
    });
    return;
  }
  const charset = type.params.get('charset') ?? 'utf-8';
  if (type.value === 'text/plain' && found.text === null) found.text = decodeCharset(content, charset);
  else if (type.value === 'text/html' && found.html === null) found.html = decodeCharset(content, charset);
}

function splitPart(raw: Buffer): { headers: Headers; body: Buffer } {
  let end = raw.indexOf('\r\n\r\n');
  let gap = 4;
  if (end < 0) {
    end = raw.indexOf('\n\n');
    gap = 2;
  }
  if (end < 0) return { headers: parseHeaders(raw.toString('utf8')), body: Buffer.alloc(0) };
  return { headers: parseHeaders(raw.subarray(0, end).toString('utf8')), body: raw.subarray(end + gap) };
}

function parseHeaders(head: string): Headers {
  const headers: Headers = new Map();
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    if (!headers.has(name)) headers.set(name, line.slice(colon + 1).trim());
  }
  return headers;
}

function splitMultipart(body: Buffer, boundary: string): Buffer[] {
  // latin1 keeps one character per byte, so the parts come back byte for byte.
  const text = body.toString('latin1');
  const delimiter = new RegExp(`(?:^|\\r?\\n)--${boundary.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`);
  const parts: Buffer[] = [];
  for (const segment of text.split(delimiter).slice(1)) {
    if (segment.startsWith('--')) break;
    parts.push(Buffer.from(segment.replace(/^[ \t]*\r?\n/, ''), 'latin1'));
  }
  return parts;
}

/** `type/subtype; a=b; c="d"` with RFC 2231 continuations and charsets (`name*0*=utf-8''…`). */
export function parseHeaderValue(header: string): HeaderValue {
  const [value = '', ...rest] = splitOutsideQuotes(header, ';');
  const pieces = new Map<string, { index: number; text: string; encoded: boolean }[]>();
  for (const param of rest) {
    const eq = param.indexOf('=');
    if (eq <= 0) continue;
    const key = param.slice(0, eq).trim().toLowerCase();
    let text = param.slice(eq + 1).trim();
    if (text.startsWith('"') && text.endsWith('"')) text = text.slice(1, -1).replace(/\\(.)/g, '$1');
    const match = /^([^*]+)(?:\*(\d+))?(\*)?$/.exec(key);
    if (!match) continue;
    const name = match[1]!;
    const list = pieces.get(name) ?? [];
    list.push({ index: Number(match[2] ?? 0), text, encoded: match[3] === '*' });
    pieces.set(name, list);
  }
  const params = new Map<string, string>();
  for (const [name, list] of pieces) {
    list.sort((a, b) => a.index - b.index);
    let charset = 'utf-8';
    const bytes: Buffer[] = [];
    list.forEach((piece, i) => {
      let text = piece.text;
      if (piece.encoded && i === 0) {
        const declared = /^([^']*)'[^']*'(.*)$/.exec(text);
        if (declared) {
          charset = declared[1] || charset;
          text = declared[2]!;
        }
      }
      bytes.push(piece.encoded ? percentDecode(text) : Buffer.from(text, 'utf8'));
    });
    params.set(name, decodeWords(decodeCharset(Buffer.concat(bytes), charset)));
  }
  return { value: value.trim().toLowerCase(), params };
}

function splitOutsideQuotes(text: string, separator: string): string[] {
  const out: string[] = [];
  let current = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const char = text[i]!;
    if (char === '\\' && quoted) {
      current += char + (text[++i] ?? '');
      continue;
    }
    if (char === '"') quoted = !quoted;
    if (char === separator && !quoted) {
      out.push(current);
      current = '';
    } else current += char;
  }
  out.push(current);
  return out;
}

function percentDecode(text: string): Buffer {
  const bytes: number[] = [];
  for (let i = 0; i < text.length; i++) {
    if (text[i] === '%' && /^[0-9a-f]{2}$/i.test(text.slice(i + 1, i + 3))) {
      bytes.push(parseInt(text.slice(i + 1, i + 3), 16));
      i += 2;
    } else bytes.push(text.charCodeAt(i) & 0xff);
  }
  return Buffer.from(bytes);
}

/** RFC 2047 encoded words, `=?utf-8?Q?…?=` and `=?utf-8?B?…?=`; the space between two is dropped. */
export function decodeWords(text: string): string {
  return text
    .replace(/(=\?[^?\s]+\?[bq]\?[^?\s]*\?=)\s+(?==\?[^?\s]+\?[bq]\?)/gi, '$1')
    .replace(/=\?([^?\s]+)\?([bq])\?([^?\s]*)\?=/gi, (_, charset: string, kind: string, data: string) => {
      const bytes =
        kind.toLowerCase() === 'b'
          ? Buffer.from(data, 'base64')
          : quotedPrintable(data.replace(/_/g, ' '), false);
      return decodeCharset(bytes, charset.replace(/\*.*$/, ''));
    });
}

function decodeTransfer(body: Buffer, encoding: string | undefined): Buffer {
  switch (encoding?.trim().toLowerCase()) {
    case 'base64':
      return Buffer.from(body.toString('latin1').replace(/[^A-Za-z0-9+/=]/g, ''), 'base64');
    case 'quoted-printable':
      return quotedPrintable(body.toString('latin1'), true);
    default:
      return body;
  }
}

function quotedPrintable(text: string, softBreaks: boolean): Buffer {
  const source = softBreaks ? text.replace(/=\r?\n/g, '') : text;
  const bytes: number[] = [];
  for (let i = 0; i < source.length; i++) {
    const hex = source.slice(i + 1, i + 3);
    if (source[i] === '=' && /^[0-9a-f]{2}$/i.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else bytes.push(source.charCodeAt(i) & 0xff);
  }
  return Buffer.from(bytes);
}

function decodeCharset(bytes: Buffer, charset: string): string {
  try {
    return new TextDecoder(charset.trim().toLowerCase()).decode(bytes);
  } catch {
    return new TextDecoder('utf-8').decode(bytes);
  }
}

function splitAddresses(list: string): string[] {
  return splitOutsideQuotes(list, ',')
    .map((address) => address.trim())
    .filter(Boolean);
}

function htmlToText(html: string): string {
  return html
    .replace(/<(script|style)[\s\S]*?<\/\1>/gi, '')
    .replace(/<br\s*\/?>|<\/p>/gi, '\n')
    .replace(/<[^>]+>/g, '')
    .replace(/&nbsp;/g, ' ')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&amp;/g, '&')
    .trim();
}
