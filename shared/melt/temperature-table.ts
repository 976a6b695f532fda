/**
 * A function of temperature tabulated on an even grid, read by linear interpolation, so the hour
 * loop reads a table instead of calling exp or pow. Temperatures outside the grid read its ends.
 */
export interface TemperatureTable {
  minC: number;
  maxC: number;
  stepC: number;
  values: Float64Array;
}

export function tabulate(fn: (tempC: number) => number, minC: number, maxC: number, stepC: number): TemperatureTable {
  const n = Math.round((maxC - minC) / stepC) + 2;
  const values = new Float64Array(n);
  for (let i = 0; i < n; i++) values[i] = fn(Math.min(maxC, minC + i * stepC));
  return { minC, maxC, stepC, values };
}

export function readTable(table: TemperatureTable, tempC: number): number {
  return readAt(table, tablePosition(table, tempC));
}

/** Position of a temperature on a table's grid: node index plus fraction (the ends for temperatures outside). */
export function tablePosition(table: TemperatureTable, tempC: number): number {
  const t = tempC < table.minC ? table.minC : tempC > table.maxC ? table.maxC : tempC;
  return (t - table.minC) / table.stepC;
}

/** A table's value at a position from tablePosition (of this table or of one on the same grid). */
export function readAt(table: TemperatureTable, position: number): number {
  const i = position | 0;
  const v = table.values;
  return v[i] + (v[i + 1] - v[i]) * (position - i);
}

export function sameGrid(a: TemperatureTable, b: TemperatureTable): boolean {
  return a.minC === b.minC && a.maxC === b.maxC && a.stepC === b.stepC && a.values.length === b.values.length;
}
