export interface HypsometryRow {
  lowerM: number;
  upperM: number;
  areaKm2: number;
  glacierAreaKm2: number;
  debrisAreaKm2: number;
}

/**
 * Area–elevation distribution of the catchment in fixed steps (e.g. 50 m): catchment, glacier
 * and debris-covered glacier area per step, from the lowest to the highest cell.
 */
export function hypsometry(z: Float32Array, band: Int16Array, glacier: Uint8Array, debris: Uint8Array, cellAreaByColumn: Float64Array, width: number, stepM: number): HypsometryRow[] {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < z.length; i++) if (band[i] >= 0) { if (z[i] < min) min = z[i]; if (z[i] > max) max = z[i]; }
  if (min === Infinity) return [];
  const lowest = Math.floor(min / stepM) * stepM;
  const count = Math.max(1, Math.ceil((max - lowest) / stepM));
  const area = new Float64Array(count);
  const ice = new Float64Array(count);
  const rock = new Float64Array(count);
  for (let i = 0; i < z.length; i++) {
    if (band[i] < 0) continue;
    const k = Math.min(count - 1, Math.floor((z[i] - lowest) / stepM));
    const a = cellAreaByColumn[i % width];
    area[k] += a;
    if (glacier[i]) ice[k] += a;
    if (debris[i]) rock[k] += a;
  }
  return Array.from(area, (a, k) => ({
    lowerM: lowest + k * stepM,
    upperM: lowest + (k + 1) * stepM,
    areaKm2: a / 1e6,
    glacierAreaKm2: ice[k] / 1e6,
    debrisAreaKm2: rock[k] / 1e6,
  }));
}
