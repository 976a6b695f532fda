/**
 * CSV output that spreadsheets cannot mistake for formulas: a cell starting with =, +, -, @,
 * tab or carriage return gets a leading single quote (the common OWASP advice on CSV injection).
 * Numbers are written as numbers, so negative temperatures stay numeric.
 */
export function csvCell(value: string | number | null): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const safe = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function csvLine(cells: readonly (string | number | null)[]): string {
  return cells.map(csvCell).join(',');
}

/** A whole CSV document with CRLF line ends (RFC 4180). */
export function csvDocument(header: readonly string[], rows: Iterable<readonly (string | number | null)[]>): string {
  const lines = [csvLine(header)];
  for (const row of rows) lines.push(csvLine(row));
  return `${lines.join('\r\n')}\r\n`;
}

/** A file name safe for Content-Disposition. */
export function safeFileName(name: string): string {
  return name.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'download';
}

const BYTE_ORDER_MARK = '\uFEFF';

/** CSV text as every download sends it: with a byte-order mark, so spreadsheet programs read °C, m³ and km² as UTF-8. */
export function withByteOrderMark(text: string): string {
  return text.startsWith(BYTE_ORDER_MARK) ? text : `${BYTE_ORDER_MARK}${text}`;
}
