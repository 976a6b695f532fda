import { variableSpec, type UnitOption, type Variable } from '../../../../shared/schemas/dataset-variables';
import { validationFailed } from '../../../errors';
import { headerTokens, parseNumber } from './read-table';
import { parseTimestamp } from './timestamps';

const TIME_WORDS = new Set(['date', 'time', 'datetime', 'timestamp', 'date_time', 'day', 'hour', 'valid', 'utc', 'local']);

export interface SeriesColumns {
  timeColumn: number;
  valueColumn: number;
}

/**
 * Finds the date/time column and the value column of the chosen variable. A file whose first line
 * is data rather than names, or whose names do not say which column is which, is refused with the
 * names found and what was expected.
 */
export function findSeriesColumns(header: string[], variable: Variable): SeriesColumns {
  if (parseTimestamp(header[0] ?? '') !== null || header.some((h) => parseNumber(h, false) !== null)) {
    throw validationFailed('The first line holds data, not column names. Add a header line such as "date,temperature_c".', 'file');
  }
  const timeColumn = header.findIndex((h) => headerTokens(h).some((t) => TIME_WORDS.has(t)));
  const spec = variableSpec(variable);
  const expected = `a date/time column (named date, time, datetime or timestamp) and a ${spec.label.toLowerCase()} column (e.g. "${spec.headerTokens[0]}")`;
  if (timeColumn < 0) {
    throw validationFailed(`Column names not recognised: found ${quoteAll(header)}; expected ${expected}.`, 'file', { columns: header });
  }
  const others = header.map((_, i) => i).filter((i) => i !== timeColumn && header[i] !== '');
  const named = others.filter((i) => headerTokens(header[i]).some((t) => (spec.headerTokens as readonly string[]).includes(t)));
  const valueColumn = others.length === 1 ? others[0] : named.length === 1 ? named[0] : -1;
  if (valueColumn < 0) {
    const why = others.length === 0 ? 'there is no value column' : `none or several of ${quoteAll(others.map((i) => header[i]))} could be the ${spec.label.toLowerCase()}`;
    throw validationFailed(`Column names not recognised: ${why}; expected ${expected}.`, 'file', { columns: header });
  }
  return { timeColumn, valueColumn };
}

export interface UnitChoice {
  option: UnitOption;
  note: string;
}

/** The unit to read values in: the one chosen in the form, else the one named in the header, else the usual one (said so). */
export function chooseUnit(variable: Variable, header: string, requested: string | undefined): UnitChoice {
  const spec = variableSpec(variable);
  if (requested) {
    const option = spec.units.find((u) => u.unit.toLowerCase() === requested.toLowerCase());
    if (!option) throw validationFailed(`must be one of ${spec.units.map((u) => u.unit).join(', ')} for ${spec.label.toLowerCase()}`, 'unit');
    return { option, note: `Values read in ${option.unit}, as chosen.` };
  }
  const words = headerTokens(header).slice(1);
  const option = spec.units.find((u) => u.headerTokens.some((t) => words.includes(t)));
  if (option) return { option, note: `Unit ${option.unit} taken from the column name "${header}".` };
  const usual = spec.units[0];
  return { option: usual, note: `No unit in the column name "${header}"; assumed ${usual.unit}.` };
}

function quoteAll(names: string[]): string {
  return names.map((n) => `"${n}"`).join(', ');
}
