import { BAND_FIELDS, bandCsvHeader, bandFieldOfHeader, bandTableProblems, type BandField, type BandFileReply } from '../../../../shared/schemas/catchment-bands';
import { validationFailed } from '../../../errors';
import { parseNumber, readCsvTable } from './read-table';

/**
 * Reads a band table from CSV. The header must name every band column, in any order, as the
 * download writes it ("Lower elevation (m)"), by its label or by the field's name (lowerM); the
 * rows come back with every problem by line and column so the user can fix them in the table
 * editor before saving.
 */
export function readBandFile(text: string): BandFileReply {
  const table = readCsvTable(text);
  const lookup = new Map<BandField, number>();
  table.header.forEach((h, i) => {
    const field = bandFieldOfHeader(h);
    if (field && !lookup.has(field)) lookup.set(field, i);
  });
  const missing = BAND_FIELDS.filter((f) => !lookup.has(f));
  if (missing.length > 0) {
    throw validationFailed(
      `The first line does not name every band column: ${missing.map(bandCsvHeader).join(', ')} missing. The columns are ${BAND_FIELDS.map(bandCsvHeader).join(', ')}.`,
      'file', { columns: table.header },
    );
  }
  const decimalComma = table.delimiter === ';';
  const problems: BandFileReply['problems'] = [];
  const bands = table.rows.map((cells, index) => {
    const band: Record<string, number | null> = {};
    for (const field of BAND_FIELDS) {
      const cell = (cells[lookup.get(field)!] ?? '').trim();
      const value = parseNumber(cell, decimalComma);
      if (value === null) problems.push({ row: index + 1, column: field, message: cell === '' ? 'is empty' : `"${cell.slice(0, 40)}" is not a number` });
      band[field as BandField] = value;
    }
    return band;
  });
  // Every problem at once, by row: unreadable cells, each row's checks and the order of the rows.
  return { bands, problems: bandTableProblems(bands, problems) };
}
