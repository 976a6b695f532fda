import Papa from 'papaparse';
import { AppError, badRequest, validationFailed } from '../../../errors';

/** The largest file an upload may be; stated in every refusal. */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;
export const MAX_UPLOAD_LABEL = '10 MB';

export interface CsvTable {
  header: string[];
  /** Data rows; row i is line i + 2 of the file (line 1 is the header). */
  rows: string[][];
  delimiter: string;
}

export const notCsv = (message: string) => new AppError(415, 'not_csv', message);

/** Decodes an uploaded file as UTF-8 text, refusing binary content and empty files. */
export function decodeCsvText(buffer: Buffer): string {
  if (buffer.length === 0) throw badRequest('The file is empty.', 'file');
  if (buffer.includes(0)) throw notCsv('The file is not a CSV text file (it contains binary data).');
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw notCsv('The file is not a CSV text file (it is not UTF-8 text).');
  }
  text = text.replace(/^\uFEFF/, '');
  if (text.trim() === '') throw badRequest('The file is empty.', 'file');
  return text;
}

/**
 * Splits CSV text into a header and rows. The delimiter is detected among comma, semicolon and tab;
 * blank lines are skipped. A file with a header and no data rows is refused.
 */
export function readCsvTable(text: string): CsvTable {
  const delimiter = guessDelimiter(text);
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: true });
  const [header, ...lines] = parsed.data;
  if (!header || header.every((cell) => cell.trim() === '')) throw badRequest('The file is empty.', 'file');
  const rows = lines.filter((cells) => cells.some((cell) => cell.trim() !== ''));
  if (rows.length === 0) throw validationFailed('The file has a header but no data rows.', 'file');
  return { header: header.map((h) => h.trim()), rows, delimiter };
}

/** The delimiter that splits the header line most often: comma, semicolon or tab (comma when none does). */
function guessDelimiter(text: string): string {
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  const counts = [',', ';', '\t'].map((d) => [d, firstLine.split(d).length - 1] as const);
  const [best, count] = counts.reduce((a, b) => (b[1] > a[1] ? b : a));
  return count > 0 ? best : ',';
}

/** Lower-case words of a column header, keeping unit marks such as °C, %, m3/s. */
export function headerTokens(header: string): string[] {
  return header.toLowerCase().split(/[^a-z0-9%°³²/-]+/).filter(Boolean);
}

/** Reads a number written with a decimal point, or a decimal comma when the file uses them. */
export function parseNumber(cell: string, decimalComma: boolean): number | null {
  const text = decimalComma ? cell.replace(',', '.') : cell;
  return /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text) ? Number(text) : null;
}

const MISSING_MARKS = new Set(['', 'na', 'nan', 'null', 'n/a', '-']);
/** True for the marks stations commonly write for "no value" (empty, NA, NaN, null, -). */
export function isMissingMark(cell: string): boolean {
  return MISSING_MARKS.has(cell.toLowerCase());
}
