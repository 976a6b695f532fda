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
  const t = tempC < table.minC ? table.minC : tempC > table.maxC ? table.maxC : tempC;
  const x = (t - table.minC) / table.stepC;
  const i = x | 0;
  const v = table.values;
  return v[i] + (v[i + 1] - v[i]) * (x - i);
}
