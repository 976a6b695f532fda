import type { CatchmentZones } from './derive';
import type { Raster } from './raster';
import { gridCoordinateRows, pointTransform } from './reproject';
import { sampleBilinear, sampleNearest } from './raster';

/**
 * Values of another raster (any grid and system) at the centre of every catchment cell of the
 * zones, nearest-neighbour for class maps and bilinear for continuous values (as gdalwarp
 * -r near / bilinear). Cells outside the catchment, or off the raster, get NaN.
 */
export function sampleAtZones(zones: CatchmentZones, raster: Raster, method: 'nearest' | 'bilinear'): Float32Array {
  const { grid } = zones;
  const out = new Float32Array(grid.width * grid.height).fill(NaN);
  const rows = gridCoordinateRows(grid, pointTransform(zones.crs, raster.crs), Math.min(raster.dx, raster.dy) / 8);
  const xs = new Float64Array(grid.width);
  const ys = new Float64Array(grid.width);
  const sample = method === 'nearest' ? sampleNearest : sampleBilinear;
  for (let row = 0; row < grid.height; row++) {
    let any = false;
    for (let col = 0; col < grid.width && !any; col++) any = zones.band[row * grid.width + col] >= 0;
    if (!any) continue;
    rows(row, xs, ys);
    for (let col = 0; col < grid.width; col++) {
      const i = row * grid.width + col;
      if (zones.band[i] >= 0) out[i] = sample(raster, xs[col], ys[col]);
    }
  }
  return out;
}
