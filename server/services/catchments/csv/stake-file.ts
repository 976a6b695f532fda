import { variableSpec } from '../../../../shared/schemas/dataset-variables';
import type { Problem } from '../../../../shared/schemas/datasets';
import { STAKE_COLUMNS, type StakeReading } from '../../../../shared/schemas/stakes';
import { validationFailed } from '../../../errors';
import { parseNumber, readCsvTable } from './read-table';
import { chooseUnit } from './series-columns';
import type { ReadSeries } from './series-file';
import { formatMinutes, parseTimestamp } from './timestamps';

const LISTED_PROBLEMS = 200;
const DELIMITER_NAMES: Record<string, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };

/**
 * Reads stake readings: columns stake, elevation_m, from, to, balance (m w.e. unless the header
 * or the form says mm w.e.). Problems by line and column: unreadable dates, a period that ends
 * before it starts, non-numbers, implausible elevations or balances, a stake read twice for one period.
 */
export function readStakeFile(text: string, requestedUnit: string | undefined): ReadSeries & { readings: StakeReading[] } {
  const table = readCsvTable(text);
  const lower = table.header.map((h) => h.toLowerCase());
  const index = Object.fromEntries(STAKE_COLUMNS.map((c) => [c, lower.findIndex((h) => h === c || h.startsWith(`${c}_`) || h.startsWith(`${c} `))]));
  const missing = STAKE_COLUMNS.filter((c) => index[c] < 0);
  if (missing.length) {
    throw validationFailed(`Column names not recognised: missing ${missing.join(', ')}; a stake file needs ${STAKE_COLUMNS.join(',')}.`, 'file', { columns: table.header });
  }
  const spec = variableSpec('pointBalance');
  const balanceName = table.header[index.balance];
  const unit = chooseUnit('pointBalance', balanceName, requestedUnit);
  const decimalComma = table.delimiter === ';';
  const problems: Problem[] = [];
  const counts: Record<string, number> = {};
  const report = (p: Problem) => {
    counts[p.kind] = (counts[p.kind] ?? 0) + 1;
    if (problems.length < LISTED_PROBLEMS) problems.push(p);
  };
  const seen = new Map<string, number>();
  const readings: StakeReading[] = [];
  const firstRows: ReadSeries['preview']['firstRows'] = [];
  table.rows.forEach((cells, i) => {
    const line = i + 2;
    const cell = (c: (typeof STAKE_COLUMNS)[number]) => (cells[index[c]] ?? '').trim();
    const stake = cell('stake');
    const from = parseTimestamp(cell('from'));
    const to = parseTimestamp(cell('to'));
    const elevation = parseNumber(cell('elevation_m'), decimalComma);
    const raw = parseNumber(cell('balance'), decimalComma);
    let rowOk = true;
    const flag = (p: Problem) => {
      rowOk = false;
      report(p);
    };
    if (stake === '') flag({ kind: 'not_a_number', severity: 'error', row: line, column: table.header[index.stake], message: 'the stake has no name' });
    for (const [value, column] of [[from, 'from'], [to, 'to']] as const) {
      if (value === null) flag({ kind: 'unreadable_date', severity: 'error', row: line, column: table.header[index[column]], message: `"${cell(column)}" is not a date such as 2024-05-01` });
    }
    if (from !== null && to !== null && to <= from) flag({ kind: 'out_of_order', severity: 'error', row: line, column: table.header[index.to], message: 'the period ends before it starts' });
    if (elevation === null) flag({ kind: 'not_a_number', severity: 'error', row: line, column: table.header[index.elevation_m], message: `"${cell('elevation_m')}" is not a number` });
    else if (elevation < -500 || elevation > 9000) flag({ kind: 'implausible', severity: 'error', row: line, column: table.header[index.elevation_m], message: `${elevation} m is outside −500 to 9000 m` });
    const balance = raw === null ? null : unit.option.toStored(raw);
    if (balance === null) flag({ kind: 'not_a_number', severity: 'error', row: line, column: balanceName, message: `"${cell('balance')}" is not a number` });
    else if (balance < spec.min || balance > spec.max) flag({ kind: 'implausible', severity: 'error', row: line, column: balanceName, message: `${balance} m w.e. is outside ${spec.min} to ${spec.max} m w.e.` });
    const key = `${stake}|${cell('from')}`;
    if (seen.has(key)) flag({ kind: 'duplicate', severity: 'error', row: line, column: table.header[index.stake], message: `stake ${stake} from ${cell('from')} was already read on line ${seen.get(key)}` });
    seen.set(key, line);
    if (!rowOk || from === null || to === null || elevation === null || balance === null) return;
    const reading = { stake, elevationM: elevation, from: formatMinutes(from, 'daily'), to: formatMinutes(to, 'daily'), balanceMWe: balance };
    readings.push(reading);
    if (firstRows.length < 10) firstRows.push({ row: line, time: `${reading.from} to ${reading.to}, ${stake} at ${elevation} m`, value: balance });
  });
  const starts = readings.map((r) => r.from).sort();
  const ends = readings.map((r) => r.to).sort();
  return {
    readings,
    times: [],
    values: [],
    preview: {
      variable: 'pointBalance',
      unit: unit.option.unit,
      storedUnit: spec.storedUnit,
      unitNote: unit.note,
      timeStep: 'daily',
      timeStepNote: 'Stake periods, dated by day.',
      delimiter: DELIMITER_NAMES[table.delimiter] ?? table.delimiter,
      decimalComma,
      columns: table.header.map((name, i) => ({ name, role: Object.values(index).includes(i) ? (i === index.balance ? 'value' : 'time') : 'ignored' })),
      firstRows,
      rowCount: table.rows.length,
      valueCount: readings.length,
      first: starts[0] ?? null,
      last: ends[ends.length - 1] ?? null,
      problems: problems.sort((a, b) => a.row - b.row),
      problemCounts: counts,
      canConfirm: Object.keys(counts).length === 0 && readings.length > 0,
    },
  };
}
