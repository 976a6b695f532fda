import { ASPECT_CLASS_VALUES, type BandRow } from '../schemas/catchment-bands';

/** Elevation stored for cells outside the catchment in a map's cell layer. */
export const OUTSIDE_CATCHMENT = -32768;

/**
 * Which band row each map cell belongs to, as runs per map row ([row index, count, …], −1 off the
 * catchment). `cells` holds an Int16 elevation per cell (little-endian, OUTSIDE_CATCHMENT off the
 * catchment), then one byte per cell with its aspect class (0 N, 1 E, 2 S, 3 W). A cell goes to
 * the elevation range holding its elevation (the end ranges take what lies beyond them) and,
 * where the band is split into response units, to the unit of its aspect; the first unit of a
 * range stands for aspects the table gives no unit of.
 */
export function encodeUnitRuns(cells: Uint8Array, width: number, height: number, bands: readonly Pick<BandRow, 'lowerM' | 'upperM' | 'aspectClass'>[]): number[][] {
  const n = width * height;
  const view = new DataView(cells.buffer, cells.byteOffset, cells.byteLength);
  const ranges: { lowerM: number; upperM: number; byAspect: number[] }[] = [];
  bands.forEach((b, i) => {
    let range = ranges.at(-1);
    if (!range || range.lowerM !== b.lowerM || range.upperM !== b.upperM) {
      range = { lowerM: b.lowerM, upperM: b.upperM, byAspect: [i, i, i, i] };
      ranges.push(range);
    }
    if (b.aspectClass) range.byAspect[ASPECT_CLASS_VALUES.indexOf(b.aspectClass)] = i;
  });
  const out: number[][] = [];
  for (let r = 0; r < height; r++) {
    const runs: number[] = [];
    for (let c = 0; c < width; c++) {
      const k = r * width + c;
      const z = view.getInt16(k * 2, true);
      let unit = -1;
      if (z !== OUTSIDE_CATCHMENT && ranges.length > 0) {
        let b = 0;
        while (b < ranges.length - 1 && z >= ranges[b].upperM) b++;
        unit = ranges[b].byAspect[cells[2 * n + k]];
      }
      if (runs.length > 0 && runs[runs.length - 2] === unit) runs[runs.length - 1]++;
      else runs.push(unit, 1);
    }
    out.push(runs);
  }
  return out;
}

/** The band row of every map cell (row-major), −1 off the catchment: the inverse of `encodeUnitRuns`. */
export function decodeUnitRuns(runs: readonly (readonly number[])[], width: number): Int32Array {
  const out = new Int32Array(runs.length * width).fill(-1);
  runs.forEach((row, r) => {
    let c = r * width;
    for (let k = 0; k + 1 < row.length; k += 2) {
      out.fill(row[k], c, c + row[k + 1]);
      c += row[k + 1];
    }
  });
  return out;
}
