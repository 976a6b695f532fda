/** A received single-part text mail, decoded enough to read in the development inbox. */
export interface ParsedMail {
  subject: string;
  from: string;
  to: string[];
  text: string;
}

function headersOf(head: string): Map<string, string> {
  const headers = new Map<string, string>();
  // Folded header lines continue with whitespace (RFC 5322, section 2.2.3).
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  return headers;
}

/** RFC 2047 encoded words (`=?UTF-8?B?…?=` and `=?UTF-8?Q?…?=`) in headers. */
export function decodeEncodedWords(value: string): string {
  return value.replace(/=\?([^?]+)\?([bBqQ])\?([^?]*)\?=\s*(?==\?)?/g, (_all, _charset: string, kind: string, data: string) =>
    kind.toUpperCase() === 'B'
      ? Buffer.from(data, 'base64').toString('utf8')
      : decodeQuotedPrintable(data.replace(/_/g, ' ')),
  );
}

/** RFC 2045 quoted-printable: soft line breaks removed, `=XX` bytes decoded as UTF-8. */
export function decodeQuotedPrintable(value: string): string {
  const bytes = value.replace(/=\r?\n/g, '').replace(/=([0-9A-Fa-f]{2})/g, (_all, hex: string) => `%${hex}`);
  try {
    return decodeURIComponent(bytes.replace(/%(?![0-9A-Fa-f]{2})/g, '%25'));
  } catch {
    return bytes;
  }
}

export function parseMail(raw: string, envelopeTo: string[]): ParsedMail {
  const split = raw.search(/\r?\n\r?\n/);
  const head = split < 0 ? raw : raw.slice(0, split);
  const body = split < 0 ? '' : raw.slice(split).replace(/^\r?\n\r?\n/, '');
  const headers = headersOf(head);
  const encoding = (headers.get('content-transfer-encoding') ?? '7bit').toLowerCase();
  const text =
    encoding === 'base64'
      ? Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8')
      : encoding === 'quoted-printable'
        ? decodeQuotedPrintable(body)
        : body;
  return {
    subject: decodeEncodedWords(headers.get('subject') ?? ''),
    from: decodeEncodedWords(headers.get('from') ?? ''),
    to: envelopeTo,
    text: text.replace(/\r\n/g, '\n').trimEnd(),
  };
}
