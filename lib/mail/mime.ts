// Reads a received MIME message far enough for the local mail viewer: headers (with RFC 2047 encoded
// words), the first text/plain and text/html parts of a multipart tree, base64 and quoted-printable
// bodies in any charset Node's TextDecoder knows. Anything it cannot read stays visible as the raw source.

export interface ReadMessage {
  headers: Record<string, string>;
  subject: string;
  from: string;
  to: string;
  messageId: string | null;
  text: string;
  html: string;
}

function splitHead(raw: string): { head: string; body: string } {
  const m = /\r?\n\r?\n/.exec(raw);
  if (!m) return { head: raw, body: '' };
  return { head: raw.slice(0, m.index), body: raw.slice(m.index + m[0].length) };
}

function parseHeaders(head: string): Record<string, string> {
  const out: Record<string, string> = {};
  const unfolded = head.replace(/\r?\n[ \t]+/g, ' ');
  for (const line of unfolded.split(/\r?\n/)) {
    const i = line.indexOf(':');
    if (i <= 0) continue;
    const key = line.slice(0, i).trim().toLowerCase();
    if (!(key in out)) out[key] = line.slice(i + 1).trim();
  }
  return out;
}

function decoderFor(charset: string | undefined): TextDecoder {
  try {
    return new TextDecoder((charset || 'utf-8').toLowerCase());
  } catch {
    return new TextDecoder('utf-8');
  }
}

function qpBytes(s: string, header = false): Uint8Array {
  const src = header ? s.replace(/_/g, ' ') : s.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < src.length; i++) {
    const c = src[i];
    if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(src.slice(i + 1, i + 3))) {
      bytes.push(parseInt(src.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      // Raw characters of a 7/8-bit body are bytes already (the source was read as latin1).
      bytes.push(src.charCodeAt(i) & 0xff);
    }
  }
  return Uint8Array.from(bytes);
}

/** Decodes RFC 2047 encoded words ("=?UTF-8?Q?Oil_too_cold?="); blanks between adjacent words go. */
export function decodeWords(value: string): string {
  return value
    .replace(/(\?=)\s+(=\?)/g, '$1$2')
    .replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_all, charset: string, enc: string, data: string) => {
      const bytes = enc.toUpperCase() === 'B' ? Buffer.from(data, 'base64') : qpBytes(data, true);
      return decoderFor(charset.split('*')[0]).decode(bytes);
    });
}

function param(value: string, name: string): string | undefined {
  const m = new RegExp(`;\\s*${name}\\s*=\\s*(?:"([^"]*)"|([^;\\s]+))`, 'i').exec(value);
  return m ? (m[1] ?? m[2]) : undefined;
}

function decodeBody(body: string, encoding: string, charset: string | undefined): string {
  const enc = encoding.toLowerCase();
  let bytes: Uint8Array;
  if (enc === 'base64') bytes = Buffer.from(body.replace(/[^A-Za-z0-9+/=]/g, ''), 'base64');
  else if (enc === 'quoted-printable') bytes = qpBytes(body);
  else bytes = Buffer.from(body, 'latin1');
  return decoderFor(charset).decode(bytes);
}

function walk(raw: string, found: { text?: string; html?: string }, depth = 0) {
  if (depth > 8) return;
  const { head, body } = splitHead(raw);
  const h = parseHeaders(head);
  const type = h['content-type'] ?? 'text/plain';
  const mediaType = type.split(';')[0].trim().toLowerCase();
  if (mediaType.startsWith('multipart/')) {
    const boundary = param(type, 'boundary');
    if (!boundary) return;
    const parts = body.split(new RegExp(`\\r?\\n?--${boundary.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(?:--)?[ \\t]*\\r?\\n?`));
    // parts[0] is the preamble, the last the epilogue (empty when the closing delimiter ends the body).
    for (const part of parts.slice(1)) if (part.trim()) walk(part, found, depth + 1);
    return;
  }
  if ((h['content-disposition'] ?? '').toLowerCase().startsWith('attachment')) return;
  const text = decodeBody(body, h['content-transfer-encoding'] ?? '7bit', param(type, 'charset'));
  if (mediaType === 'text/plain' && found.text === undefined) found.text = text.replace(/\r\n/g, '\n');
  if (mediaType === 'text/html' && found.html === undefined) found.html = text;
}

/** The message read from its source (as a latin1 string of the received bytes). */
export function readMime(raw: string): ReadMessage {
  const headers = parseHeaders(splitHead(raw).head);
  const found: { text?: string; html?: string } = {};
  walk(raw, found);
  const decoded = Object.fromEntries(Object.entries(headers).map(([k, v]) => [k, decodeWords(v)]));
  const mid = headers['message-id']?.trim() ?? null;
  return {
    headers: decoded,
    subject: decoded.subject ?? '',
    from: decoded.from ?? '',
    to: decoded.to ?? '',
    messageId: mid || null,
    text: found.text ?? '',
    html: found.html ?? '',
  };
}
