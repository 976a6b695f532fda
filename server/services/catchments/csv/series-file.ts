import type { TimeStep, Variable } from '../../../../shared/schemas/dataset-variables';
import { variableSpec } from '../../../../shared/schemas/dataset-variables';
import type { Problem, UploadPreview } from '../../../../shared/schemas/datasets';
import { roundTo } from '../../../../shared/text/numbers';
import { validationFailed } from '../../../errors';
import { isMissingMark, parseNumber, readCsvTable } from './read-table';
import { chooseUnit, findSeriesColumns } from './series-columns';
import { checkSeriesTimes, detectTimeStep } from './series-times';
import { formatMinutes, parseTimestamp } from './timestamps';

export interface SeriesFileOptions {
  variable: Variable;
  unit?: string;
  timeStep?: TimeStep;
}

/** A series file read and checked: what the preview shows, and the values to store. */
export interface ReadSeries {
  preview: Omit<UploadPreview, 'token' | 'expiresAt' | 'fileName'>;
  /** Local times 'YYYY-MM-DD HH:mm' of the rows that hold a value, in order, in the stored unit. */
  times: string[];
  values: number[];
}

/** Problems listed in full; beyond this only the counts grow. */
const LISTED_PROBLEMS = 200;
const PREVIEW_ROWS = 10;

/**
 * Reads an uploaded station series and lists every problem with its line and column:
 * unreadable dates, order, duplicates, gaps (as ranges), non-numbers, implausible values and time steps.
 */
export function readSeriesFile(text: string, options: SeriesFileOptions): ReadSeries {
  const table = readCsvTable(text);
  const { timeColumn, valueColumn } = findSeriesColumns(table.header, options.variable);
  const spec = variableSpec(options.variable);
  const timeName = table.header[timeColumn];
  const valueName = table.header[valueColumn];
  const decimalComma = table.delimiter === ';' && table.rows.some((r) => /^[+-]?\d+,\d+$/.test((r[valueColumn] ?? '').trim()));
  const unit = chooseUnit(options.variable, valueName, options.unit);

  const problems: Problem[] = [];
  const counts: Record<string, number> = {};
  const report = (p: Problem) => {
    counts[p.kind] = (counts[p.kind] ?? 0) + 1;
    if (problems.length < LISTED_PROBLEMS) problems.push(p);
  };

  const rowMinutes: number[] = [];
  const rowLines: number[] = [];
  const rowValues: number[] = [];
  const firstRows: UploadPreview['firstRows'] = [];
  table.rows.forEach((cells, index) => {
    const line = index + 2;
    const timeCell = (cells[timeColumn] ?? '').trim();
    const valueCell = (cells[valueColumn] ?? '').trim();
    const minutes = parseTimestamp(timeCell);
    if (minutes === null) {
      report({ kind: 'unreadable_date', severity: 'error', row: line, column: timeName, message: `"${clip(timeCell)}" is not a date such as 2024-03-01 or 2024-03-01 13:00` });
      return;
    }
    let value: number | null = null;
    if (isMissingMark(valueCell)) {
      report({ kind: 'missing_value', severity: 'warning', row: line, column: valueName, message: 'no value; kept as a gap' });
    } else {
      const read = parseNumber(valueCell, decimalComma);
      if (read === null) {
        report({ kind: 'not_a_number', severity: 'error', row: line, column: valueName, message: `"${clip(valueCell)}" is not a number` });
      } else {
        value = unit.option.toStored(read);
        if (value < spec.min || value > spec.max) {
          const hint = spec.storedUnit === '°C' && unit.option.unit === '°C' && read > 200 ? ' (kelvin? choose K as the unit)' : '';
          report({ kind: 'implausible', severity: 'error', row: line, column: valueName, message: `${roundTo(value, 3)} ${spec.storedUnit} is outside the plausible range ${spec.min} to ${spec.max} ${spec.storedUnit}${hint}` });
        }
      }
    }
    if (firstRows.length < PREVIEW_ROWS) firstRows.push({ row: line, time: timeCell, value: value === null ? null : roundTo(value, 3) });
    if (value !== null) {
      rowMinutes.push(minutes);
      rowLines.push(line);
      rowValues.push(value);
    }
  });

  const step = detectTimeStep(rowMinutes, options.timeStep, options.variable, report);
  checkSeriesTimes(rowMinutes, rowLines, step.step, timeName, report);
  if (rowValues.length === 0) throw validationFailed(`No row holds a readable date and a number in "${valueName}".`, 'file', { problems });

  const times = rowMinutes.map((m) => formatMinutes(m, 'hourly'));
  const hasErrors = Object.keys(counts).some((kind) => ERROR_KINDS.has(kind));
  return {
    times,
    values: rowValues,
    preview: {
      variable: options.variable,
      unit: unit.option.unit,
      storedUnit: spec.storedUnit,
      unitNote: unit.note,
      timeStep: step.step,
      timeStepNote: step.note,
      delimiter: DELIMITER_NAMES[table.delimiter] ?? table.delimiter,
      decimalComma,
      columns: table.header.map((name, i) => ({ name, role: i === timeColumn ? 'time' : i === valueColumn ? 'value' : 'ignored' })),
      firstRows,
      rowCount: table.rows.length,
      valueCount: rowValues.length,
      first: formatMinutes(rowMinutes[0], step.step),
      last: formatMinutes(rowMinutes[rowMinutes.length - 1], step.step),
      problems: problems.sort((a, b) => a.row - b.row),
      problemCounts: counts,
      canConfirm: !hasErrors,
    },
  };
}

const DELIMITER_NAMES: Record<string, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };
const ERROR_KINDS = new Set(['unreadable_date', 'out_of_order', 'duplicate', 'not_a_number', 'implausible', 'step_mismatch']);

function clip(text: string): string {
  return text.length > 40 ? `${text.slice(0, 40)}…` : text;
}

