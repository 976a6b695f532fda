/** Control characters other than tab and line ends: a spreadsheet may drop them (NUL first) and then read a formula. */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/g;
/** A formula trigger (=, +, -, @ and their full-width forms) after any blanks, or a leading tab or carriage return. */
const FORMULA_START = /^(?:[\s\u00A0\u3000]*[=+\-@\uFF1D\uFF0B\uFF0D\uFF20]|[\t\r])/;

/** Every digit of a number, never in exponent notation (1.98e-8 → 0.0000000198): spreadsheets and people read it alike. */
function plainNumber(value: number): string {
  const text = String(value);
  return /e/i.test(text) ? new Intl.NumberFormat('en-US', { useGrouping: false, maximumSignificantDigits: 17 }).format(value) : text;
}

/**
 * CSV output that spreadsheets cannot mistake for formulas: control characters (NUL among them)
 * are dropped, and a cell that would then start with a formula trigger, even after blanks, gets a
 * leading single quote (the common OWASP advice on CSV injection). Numbers are written as
 * numbers without exponents, so negative temperatures stay numeric.
 */
export function csvCell(value: string | number | null): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? plainNumber(value) : '';
  const text = value.replace(CONTROL, '');
  const safe = FORMULA_START.test(text) ? `'${text}` : text;
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
