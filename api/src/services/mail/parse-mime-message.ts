/**
 * A small MIME reader for the messages our own nodemailer sends to the local fake SMTP server:
 * headers, quoted-printable/base64 bodies and nested multipart. It is not a general mail parser.
 */

export interface ParsedMail {
  subject: string;
  text: string;
  html: string;
}

interface Part {
  headers: Map<string, string>;
  body: string;
}

function splitPart(raw: string): Part {
  const normalized = raw.replace(/\r\n/g, '\n');
  const end = normalized.indexOf('\n\n');
  const head = end === -1 ? normalized : normalized.slice(0, end);
  const body = end === -1 ? '' : normalized.slice(end + 2);
  const headers = new Map<string, string>();
  // Folded header lines continue with leading whitespace (RFC 5322 §2.2.3).
  for (const line of head.replace(/\n[ \t]+/g, ' ').split('\n')) {
    const colon = line.indexOf(':');
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  return { headers, body };
}

function decodeQuotedPrintable(text: string): string {
  const bytes: number[] = [];
  const soft = text.replace(/=\n/g, '');
  for (let i = 0; i < soft.length; i++) {
    if (soft[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(soft.slice(i + 1, i + 3))) {
      bytes.push(Number.parseInt(soft.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(soft[i], 'utf8'));
    }
  }
  return Buffer.from(bytes).toString('utf8');
}

/** Decodes RFC 2047 encoded words such as `=?UTF-8?Q?Caf=C3=A9?=`. */
export function decodeHeaderWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g, (_all, _charset, encoding: string, text: string) =>
      encoding.toUpperCase() === 'B'
        ? Buffer.from(text, 'base64').toString('utf8')
        : decodeQuotedPrintable(text.replace(/_/g, ' ')),
    );
}

function decodeBody(part: Part): string {
  const encoding = (part.headers.get('content-transfer-encoding') ?? '7bit').toLowerCase();
  if (encoding === 'base64') return Buffer.from(part.body.replace(/\s+/g, ''), 'base64').toString('utf8');
  if (encoding === 'quoted-printable') return decodeQuotedPrintable(part.body);
  return part.body;
}

function collect(part: Part, into: ParsedMail): void {
  const type = part.headers.get('content-type') ?? 'text/plain';
  const boundary = /boundary="?([^";]+)"?/i.exec(type)?.[1];
  if (/^multipart\//i.test(type) && boundary) {
    const sections = part.body.split(`--${boundary}`).slice(1);
    for (const section of sections) {
      if (section.startsWith('--')) break;
      collect(splitPart(section.replace(/^\n/, '')), into);
    }
    return;
  }
  const decoded = decodeBody(part).replace(/\n$/, '');
  if (/^text\/html/i.test(type)) into.html ||= decoded;
  else if (/^text\/plain/i.test(type)) into.text ||= decoded;
}

export function parseMimeMessage(raw: string): ParsedMail {
  const root = splitPart(raw);
  const parsed: ParsedMail = {
    subject: decodeHeaderWords(root.headers.get('subject') ?? ''),
    text: '',
    html: '',
  };
  collect(root, parsed);
  return parsed;
}
