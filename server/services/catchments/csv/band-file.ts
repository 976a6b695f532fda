import { BAND_FIELDS, bandTableProblems, type BandField, type BandFileReply } from '../../../../shared/schemas/catchment-bands';
import { validationFailed } from '../../../errors';
import { parseNumber, readCsvTable } from './read-table';

/**
 * Reads a band table from CSV. The header must name every band field (lowerM, upperM, …, in any
 * order, case-insensitive); the rows come back with every problem by line and column so the user
 * can fix them in the table editor before saving.
 */
export function readBandFile(text: string): BandFileReply {
  const table = readCsvTable(text);
  const lookup = new Map(table.header.map((h, i) => [h.toLowerCase(), i]));
  const missing = BAND_FIELDS.filter((f) => !lookup.has(f.toLowerCase()));
  if (missing.length > 0) {
    throw validationFailed(`Column names not recognised: missing ${missing.join(', ')}; the header must be ${BAND_FIELDS.join(',')}.`, 'file', { columns: table.header });
  }
  const decimalComma = table.delimiter === ';';
  const problems: BandFileReply['problems'] = [];
  const bands = table.rows.map((cells, index) => {
    const band: Record<string, number | null> = {};
    for (const field of BAND_FIELDS) {
      const cell = (cells[lookup.get(field.toLowerCase())!] ?? '').trim();
      const value = parseNumber(cell, decimalComma);
      if (value === null) problems.push({ row: index + 1, column: field, message: cell === '' ? 'is empty' : `"${cell.slice(0, 40)}" is not a number` });
      band[field as BandField] = value;
    }
    return band;
  });
  // Every problem at once, by row: unreadable cells, each row's checks and the order of the rows.
  return { bands, problems: bandTableProblems(bands, problems) };
}
