/*
 * Just enough MIME to read the mail Torquetrail sends (one text part, UTF-8): unfolded headers,
 * RFC 2047 encoded words in the subject, quoted-printable or base64 bodies. Not a general parser.
 */
export function splitMessage(raw: string): { headers: Record<string, string>; body: string } {
  const cut = raw.indexOf('\r\n\r\n');
  const head = cut >= 0 ? raw.slice(0, cut) : raw;
  const body = cut >= 0 ? raw.slice(cut + 4) : '';
  const headers: Record<string, string> = {};
  for (const line of head.replace(/\r\n[ \t]+/g, ' ').split('\r\n')) {
    const colon = line.indexOf(':');
    if (colon > 0) headers[line.slice(0, colon).trim().toLowerCase()] = line.slice(colon + 1).trim();
  }
  return { headers, body };
}

function quotedPrintable(text: string): Buffer {
  const soft = text.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < soft.length; i++) {
    if (soft[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(soft.slice(i + 1, i + 3))) {
      bytes.push(parseInt(soft.slice(i + 1, i + 3), 16));
      i += 2;
    } else bytes.push(...Buffer.from(soft[i], 'utf8'));
  }
  return Buffer.from(bytes);
}

export function decodeWords(value: string): string {
  return value.replace(/\s*=\?([^?]+)\?([BbQq])\?([^?]*)\?=\s*/g, (_m, _charset, enc: string, text: string) =>
    enc.toUpperCase() === 'B' ? Buffer.from(text, 'base64').toString('utf8') : quotedPrintable(text.replace(/_/g, ' ')).toString('utf8'));
}

export function decodeBody(headers: Record<string, string>, body: string): string {
  const encoding = (headers['content-transfer-encoding'] ?? '7bit').toLowerCase();
  if (encoding === 'base64') return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
  if (encoding === 'quoted-printable') return quotedPrintable(body).toString('utf8');
  return body;
}
