import type { Gradient } from './terrain';
import { fastAtan } from './fast-atan';
import { GroupedHistogram } from './histogram';
import { horizonTangents, horizonWork } from './horizon';
import type { GridGeometry } from './raster';

/** The horizon percentiles each band carries per sector (the engine reads them as a CDF). */
export const HORIZON_PERCENTILES = [10, 30, 50, 70, 90] as const;
const HALF_PI = Math.PI / 2;
const HORIZON_BIN_DEG = 0.1;

export interface TerrainShading {
  /** Area-weighted mean sky-view factor per zone, 0–1. */
  skyViewFactor: number[];
  /** Per zone: sectors × 5 horizon angles (degrees) at the 10/30/50/70/90th percentiles. */
  horizonDeg: number[][][];
}

/**
 * Horizons and sky-view factor summarised per zone (band or response unit).
 *
 * For each of `sectors` azimuths (sector k centred on k·360/n° clockwise from north) every
 * cell's horizon is searched along the DEM (`horizonTangents`); where no terrain lies ahead
 * inside the DEM the horizon is taken as level (0°). It is then raised to at least the cell's
 * own tangent plane in that direction, because the ground under a sloping cell hides the sky
 * below its plane. The sky-view factor is Dozier & Frew's (1990) view factor of
 * a tilted cell,
 *   V = 1/2π ∫ [cos S sin²H_φ + sin S cos(φ − A)(H_φ − sin H_φ cos H_φ)] dφ,
 * H_φ the horizon's zenith angle, S and A the cell's slope and aspect: the share of isotropic
 * diffuse sky a cell receives compared with an open horizontal surface. It is 1 on an open
 * plain, (1 + cos S)/2 on a slope whose horizon is level (the engine's isotropic default it
 * replaces) and, for a
 * horizontal cell, Oke's (1987) sky-view factor 1/2π ∫ cos² h dφ. The integral is the mean over
 * the sectors. Horizon angles are binned at 0.1° per zone and sector for the percentiles.
 *
 * @param zone zone index per cell (−1 = not counted); cells with no data must be −1
 * @param weight optional weight per cell (e.g. the share of the cell inside the outline)
 */
export function terrainShading(z: Float32Array, grid: GridGeometry, gradient: Gradient, zone: Int32Array, zoneCount: number, sectors: number, options: { curvature?: boolean; weight?: Float32Array; onSector?: (k: number) => void } = {}): TerrainShading {
  if (!Number.isInteger(sectors) || sectors < 8 || sectors > 72) throw new RangeError('sectors must be a whole number from 8 to 72');
  const cells = listZoneCells(zone);
  const { east, north } = gradient;
  // per cell, once and in cell order: gradient, 1/√(1 + g²) = cos S, the zone's histogram row, the weight
  const n = cells.length;
  const gxOf = new Float32Array(n);
  const gyOf = new Float32Array(n);
  const cosSlope = new Float32Array(n);
  const zoneOf = new Int32Array(n);
  const weightOf = new Float32Array(n);
  const svfSum = new Float64Array(zoneCount);
  const weightSum = new Float64Array(zoneCount);
  for (let c = 0; c < n; c++) {
    const i = cells[c];
    gxOf[c] = east[i];
    gyOf[c] = north[i];
    cosSlope[c] = 1 / Math.sqrt(1 + east[i] * east[i] + north[i] * north[i]);
    zoneOf[c] = zone[i];
    weightOf[c] = options.weight ? options.weight[i] : 1;
    weightSum[zone[i]] += weightOf[c];
  }
  const tangents = new Float32Array(z.length);
  const work = horizonWork(grid);
  const histogram = new GroupedHistogram(zoneCount * sectors, -90, 90, HORIZON_BIN_DEG);
  const counts = histogram.counts;
  const bins = histogram.bins;
  const binsPerRadian = 180 / Math.PI / HORIZON_BIN_DEG;
  const zeroBin = 90 / HORIZON_BIN_DEG;
  const svfPerCell = new Float64Array(n);
  const accumulate = (k: number, tangent: Float32Array) => {
    const azimuth = (k * 360) / sectors;
    const sinA = Math.sin((azimuth * Math.PI) / 180);
    const cosA = Math.cos((azimuth * Math.PI) / 180);
    const rowOffset = k * bins;
    const zoneStride = sectors * bins;
    for (let c = 0; c < n; c++) {
      const plane = gxOf[c] * sinA + gyOf[c] * cosA;
      let t = tangent[cells[c]];
      if (!(t > -Infinity)) t = 0; // no terrain ahead inside the DEM (or unknown): an open, level horizon
      if (t < plane) t = plane;
      const h = fastAtan(t);
      const cos2h = 1 / (1 + t * t);
      // viewFactorTerm, inlined for speed
      svfPerCell[c] += (cos2h - plane * (HALF_PI - h - t * cos2h)) * cosSlope[c];
      let bin = (h * binsPerRadian + zeroBin) | 0;
      if (bin >= bins) bin = bins - 1;
      counts[zoneOf[c] * zoneStride + rowOffset + bin] += weightOf[c];
    }
  };
  // sectors k and k + n/2 look along the same profiles in opposite directions: one pass serves both
  const half = sectors % 2 === 0 ? sectors / 2 : 0;
  const back = half ? new Float32Array(z.length) : null;
  let done = 0;
  for (let k = 0; k < (half || sectors); k++) {
    horizonTangents(z, grid, (k * 360) / sectors, tangents, work, options.curvature ?? true, back ?? undefined);
    accumulate(k, tangents);
    options.onSector?.(done++);
    if (back) {
      accumulate(k + half, back);
      options.onSector?.(done++);
    }
  }
  for (let c = 0; c < n; c++) svfSum[zoneOf[c]] += svfPerCell[c] * weightOf[c];
  const skyViewFactor = Array.from(svfSum, (s, zi) => (weightSum[zi] > 0 ? Math.min(1, Math.max(0, s / sectors / weightSum[zi])) : NaN));
  const horizonDeg = Array.from({ length: zoneCount }, (_, zi) =>
    Array.from({ length: sectors }, (_, k) => monotone(histogram.percentiles(zi * sectors + k, HORIZON_PERCENTILES))));
  return { skyViewFactor, horizonDeg };
}

/**
 * One direction's share of Dozier & Frew's integrand for a cell with squared gradient `g2`, whose
 * tangent plane rises by `plane` (tan) in that direction, under a horizon of tangent `t` (≥ plane):
 * cos S sin²H + sin S cos(φ − A)(H − sin H cos H) with H = 90° − atan t, written with tangents
 * (cos S = 1/√(1 + g²), sin S cos(φ − A) = −plane/√(1 + g²)). The mean over directions is V.
 */
export function viewFactorTerm(t: number, plane: number, g2: number): number {
  const cos2h = 1 / (1 + t * t);
  return (cos2h - plane * (HALF_PI - Math.atan(t) - t * cos2h)) / Math.sqrt(1 + g2);
}

function listZoneCells(zone: Int32Array): Int32Array {
  let n = 0;
  for (let i = 0; i < zone.length; i++) if (zone[i] >= 0) n++;
  const cells = new Int32Array(n);
  n = 0;
  for (let i = 0; i < zone.length; i++) if (zone[i] >= 0) cells[n++] = i;
  return cells;
}

const monotone = (values: number[]) => values.map((v, i) => Math.round(Math.max(v, ...values.slice(0, i)) * 100) / 100);

/**
 * Share of a zone that sees the sun at elevation `sunElevationDeg` in one sector, from the five
 * horizon percentiles [p10, p30, p50, p70, p90]: the piecewise-linear CDF through
 * (p10, 0.1) … (p90, 0.9), continued with the slope of its end segments down to 0 at
 * p10 − (p30 − p10)/2 and up to 1 at p90 + (p90 − p70)/2 (uniform tails), 0 below and 1 above.
 * Equal neighbouring percentiles make a step.
 */
export function sunlitFraction(quantiles: readonly number[], sunElevationDeg: number): number {
  const [p10, p30, p50, p70, p90] = quantiles;
  const xs = [p10 - (p30 - p10) / 2, p10, p30, p50, p70, p90, p90 + (p90 - p70) / 2];
  const ys = [0, 0.1, 0.3, 0.5, 0.7, 0.9, 1];
  const e = sunElevationDeg;
  if (e <= xs[0]) return 0;
  if (e >= xs[6]) return 1;
  for (let i = 1; i < xs.length; i++) {
    if (e < xs[i]) return ys[i - 1] + ((ys[i] - ys[i - 1]) * (e - xs[i - 1])) / (xs[i] - xs[i - 1]);
  }
  return 1;
}
