import { crsFromEpsg, utmCrsFor } from '../crs';
import { ringArea, type PolygonRings, type Ring } from '../outline';
import { rasterizePolygons } from '../rasterize';
import { cellCentreX, cellCentreY, type GridGeometry, type Raster } from '../raster';
import { gridCoordinateRows, pointTransform } from '../reproject';
import type { SnowClassCodes } from '../snow-cover';
import { hornGradient } from '../terrain';
import { traceMask } from '../trace';
import { matchHypsometry, pickShare } from './demo-shaping';
import { valueNoise } from './value-noise';

/** The band table the generated valley should reproduce (the demo catchment's hand-made bands). */
export interface DemoBandTarget {
  lowerM: number;
  upperM: number;
  areaKm2: number;
  glacierFraction: number;
  debrisFraction: number;
  debrisThicknessM: number;
}

export interface GeoJsonPolygons {
  type: 'FeatureCollection';
  features: { type: 'Feature'; properties: Record<string, string>; geometry: { type: 'MultiPolygon'; coordinates: number[][][][] } }[];
}

export interface DemoValley {
  /** 30 m DEM on the valley's UTM zone (m above sea level). */
  dem: Raster;
  catchment: GeoJsonPolygons;
  glaciers: GeoJsonPolygons;
  debris: GeoJsonPolygons;
  /** Debris thickness (m) on the debris-covered ice, nodata elsewhere. */
  debrisThickness: Raster;
  /** Classified snow maps in longitude/latitude, about 50 m cells. */
  snowMaps: { date: string; raster: Raster }[];
  snowClassCodes: SnowClassCodes;
  /** Glacier surface elevation change rate (m per year) on a 60 m grid. */
  elevationChange: { dhdt: Raster; fromDate: string; toDate: string };
}

/** The glacier's surface elevation change to draw on the thinning map, m per year, by band (band mid-points, interpolated between). */
export interface DemoThinningBand {
  lowerM: number;
  upperM: number;
  dhdtMPerYear: number;
}

export interface DemoValleyOptions {
  latitudeDeg: number;
  longitudeDeg: number;
  /** What the thinning map shows on the glacier, band by band (the seeds derive it from the demo's hidden "true" run). */
  thinning: DemoThinningBand[];
  seed?: number;
  cellSizeM?: number;
}

const MARGIN_M = 3000;
/** The survey dates of the demo thinning map. */
export const DEMO_THINNING_PERIOD = { fromDate: '2000-09-15', toDate: '2020-09-15' } as const;
const SNOW_CODES: SnowClassCodes = { snow: [1], noSnow: [0], cloud: [2], nodata: [255] };
/** Dates and regional snow-line elevations (m) of the demo snow maps: spring retreat, late-summer minimum, first autumn snow. */
const SNOW_DATES: [string, number, number][] = [
  ['2024-04-20', 3350, 0.05], ['2024-05-25', 3900, 0.22], ['2024-06-28', 4550, 0.1], ['2024-08-02', 5050, 0.35], ['2024-09-06', 5250, 0.08], ['2024-10-11', 4300, 0.15],
];

/**
 * An invented glacier valley, generated the same way every time from its seed: an egg-shaped
 * basin draining north through a notch, with a divide along its outline, its elevations shaped
 * so that the area per band matches `targets`, glaciers and debris placed band by band to the
 * targets' fractions, six snow maps through a melt season and a glacier thinning map.
 * Nothing in it is measured.
 */
export function generateDemoValley(targets: DemoBandTarget[], options: DemoValleyOptions): DemoValley {
  const seed = options.seed ?? 7;
  const cell = options.cellSizeM ?? 30;
  const utm = utmCrsFor(options.longitudeDeg, options.latitudeDeg);
  const wgs84 = crsFromEpsg(4326, 'dem');
  const [e0, n0] = pointTransform(wgs84, utm)(options.longitudeDeg, options.latitudeDeg);
  const areaM2 = targets.reduce((s, b) => s + b.areaKm2, 0) * 1e6;
  const ring = basinRing(areaM2, seed).map(([x, y]) => [x + e0, y + n0] as [number, number]);
  const [minX, minY, maxX, maxY] = ring.reduce((b, [x, y]) => [Math.min(b[0], x), Math.min(b[1], y), Math.max(b[2], x), Math.max(b[3], y)], [Infinity, Infinity, -Infinity, -Infinity]);
  const x0 = Math.floor((minX - MARGIN_M) / cell) * cell;
  const y0 = Math.ceil((maxY + MARGIN_M) / cell) * cell;
  const grid: GridGeometry = { x0, y0, dx: cell, dy: cell, width: Math.ceil((maxX + MARGIN_M - x0) / cell), height: Math.ceil((y0 - minY + MARGIN_M) / cell) };
  const inside = rasterizePolygons([[ring]], grid);
  const shape = shapeField(grid, ring, inside, seed);
  const z = matchHypsometry(shape.f, inside, targets);
  const dem: Raster = { ...grid, values: z, crs: utm };
  const glacier = new Uint8Array(z.length);
  const debris = new Uint8Array(z.length);
  const iceScore = noiseField(grid, seed + 11, 1800, (i, n) => 0.55 * (1 - shape.ridge[i]) + 0.3 * n + 0.15 * shape.along[i]);
  const debrisScore = noiseField(grid, seed + 23, 900, (i, n) => 0.5 * (1 - shape.along[i]) + 0.25 * shape.ridge[i] + 0.25 * n);
  targets.forEach((band) => {
    const inBand = (i: number) => inside[i] === 1 && z[i] >= band.lowerM && z[i] < band.upperM;
    pickShare(iceScore, inBand, band.glacierFraction, glacier);
    pickShare(debrisScore, (i) => inBand(i) && glacier[i] === 1, band.debrisFraction, debris);
  });
  const thicknessNoise = valueNoise(seed + 31, 700, 3);
  const thickness = new Float32Array(z.length).fill(NaN);
  for (let i = 0; i < z.length; i++) {
    if (!debris[i]) continue;
    const band = targets.find((b) => z[i] >= b.lowerM && z[i] < b.upperM);
    thickness[i] = Math.max(0.01, (band?.debrisThicknessM ?? 0.1) * (1 + 0.3 * thicknessNoise(cellCentreX(grid, i % grid.width), cellCentreY(grid, Math.floor(i / grid.width)))));
  }
  const toLonLat = pointTransform(utm, wgs84);
  const asGeoJson = (polygons: PolygonRings[], name: string): GeoJsonPolygons => ({
    type: 'FeatureCollection',
    features: [{ type: 'Feature', properties: { name }, geometry: { type: 'MultiPolygon', coordinates: polygons.map((p) => p.map((r) => r.map(([x, y]) => roundLonLat(toLonLat(x, y))))) } }],
  });
  return {
    dem,
    catchment: asGeoJson([[ring]], 'Upper Sarvel catchment above the Kolvi gauge'),
    glaciers: asGeoJson(traceMask(glacier, grid), 'Sarvel glacier and tributaries'),
    debris: asGeoJson(traceMask(debris, grid), 'Sarvel debris cover'),
    debrisThickness: { ...grid, values: thickness, crs: utm },
    snowMaps: snowMaps(dem, seed),
    snowClassCodes: SNOW_CODES,
    elevationChange: { dhdt: thinningMap(dem, glacier, options.thinning, seed), ...DEMO_THINNING_PERIOD },
  };
}

const roundLonLat = ([x, y]: [number, number]) => [Math.round(x * 1e7) / 1e7, Math.round(y * 1e7) / 1e7];

/** An egg-shaped outline (narrow northern outlet end), wobbled by a few seeded harmonics and scaled to the area. */
function basinRing(areaM2: number, seed: number): Ring {
  const wobble = valueNoise(seed + 3, 1, 1);
  const points: Ring = [];
  const n = 160;
  for (let k = 0; k < n; k++) {
    const theta = (2 * Math.PI * k) / n;
    const north = Math.cos(theta);
    const r = 1 + 0.07 * Math.sin(3 * theta + 6 * wobble(0.3, 0.7)) + 0.04 * Math.sin(5 * theta + 6 * wobble(1.7, 0.2)) + 0.02 * Math.sin(9 * theta);
    points.push([0.62 * Math.sin(theta) * r * (1 - 0.35 * Math.max(0, north)), north * r]);
  }
  points.push([points[0][0], points[0][1]]);
  const scale = Math.sqrt(areaM2 / Math.abs(ringArea(points)));
  return points.map(([x, y]) => [Math.round(x * scale), Math.round(y * scale)] as [number, number]).reverse();
}

/** A rough terrain field: rising towards the southern head, ridged along the divide except at the outlet notch, plus noise. */
function shapeField(grid: GridGeometry, ring: Ring, inside: Uint8Array, seed: number): { f: Float32Array; ridge: Float32Array; along: Float32Array } {
  const n = grid.width * grid.height;
  const f = new Float32Array(n);
  const ridge = new Float32Array(n);
  const along = new Float32Array(n);
  const [ox, oy] = ring.reduce((best, p) => (p[1] > best[1] ? p : best), ring[0]);
  const southY = ring.reduce((m, p) => Math.min(m, p[1]), Infinity);
  const distance = latticeDistances(grid, ring);
  let deepest = 0;
  for (let i = 0; i < n; i++) if (inside[i]) deepest = Math.max(deepest, distance[i]);
  const rough = valueNoise(seed, 2600, 5);
  for (let i = 0; i < n; i++) {
    const x = cellCentreX(grid, i % grid.width);
    const y = cellCentreY(grid, Math.floor(i / grid.width));
    const t = Math.min(1, Math.max(0, (oy - y) / (oy - southY)));
    const d = distance[i] / deepest;
    const notch = 1 - Math.exp(-((Math.hypot(x - ox, y - oy) / 2500) ** 2));
    const r = inside[i] ? (1 - Math.min(1, d)) ** 1.6 : Math.max(-1, 1 - 0.9 * d);
    ridge[i] = Math.max(0, r);
    along[i] = t;
    f[i] = 0.55 * t ** 0.85 + 0.45 * r * notch + 0.06 * rough(x, y);
  }
  return { f, ridge, along };
}

/** Distance of every cell centre to the outline, computed exactly every fourth cell and interpolated between (distance varies smoothly). */
function latticeDistances(grid: GridGeometry, ring: Ring): Float32Array {
  const step = 4;
  const cols = Math.ceil(grid.width / step) + 1;
  const rows = Math.ceil(grid.height / step) + 1;
  const lattice = new Float32Array(cols * rows);
  for (let j = 0; j < rows; j++) for (let i = 0; i < cols; i++) lattice[j * cols + i] = distanceToRing(ring, cellCentreX(grid, i * step), cellCentreY(grid, j * step));
  const out = new Float32Array(grid.width * grid.height);
  for (let r = 0; r < grid.height; r++) {
    const j = Math.floor(r / step);
    const ty = (r - j * step) / step;
    for (let c = 0; c < grid.width; c++) {
      const i = Math.floor(c / step);
      const tx = (c - i * step) / step;
      const at = (jj: number, ii: number) => lattice[jj * cols + ii];
      out[r * grid.width + c] = (1 - ty) * ((1 - tx) * at(j, i) + tx * at(j, i + 1)) + ty * ((1 - tx) * at(j + 1, i) + tx * at(j + 1, i + 1));
    }
  }
  return out;
}

function distanceToRing(ring: Ring, x: number, y: number): number {
  let best = Infinity;
  for (let k = 0; k + 1 < ring.length; k++) {
    const [ax, ay] = ring[k];
    const [bx, by] = ring[k + 1];
    const ex = bx - ax;
    const ey = by - ay;
    const t = Math.max(0, Math.min(1, ((x - ax) * ex + (y - ay) * ey) / (ex * ex + ey * ey)));
    best = Math.min(best, Math.hypot(x - ax - t * ex, y - ay - t * ey));
  }
  return best;
}

function noiseField(grid: GridGeometry, seed: number, scaleM: number, combine: (i: number, noise: number) => number): Float32Array {
  const noise = valueNoise(seed, scaleM, 3);
  return Float32Array.from({ length: grid.width * grid.height }, (_, i) => combine(i, noise(cellCentreX(grid, i % grid.width), cellCentreY(grid, Math.floor(i / grid.width)))));
}

/** Snow where the terrain is above the date's snow line (lower on north-facing slopes, patchy), cloud where a seeded cloud field is thick. */
function snowMaps(dem: Raster, seed: number): { date: string; raster: Raster }[] {
  const wgs84 = crsFromEpsg(4326, 'snowCover');
  const toLonLat = pointTransform(dem.crs, wgs84);
  const [west, north] = toLonLat(dem.x0, dem.y0);
  const [east, south] = toLonLat(dem.x0 + dem.width * dem.dx, dem.y0 - dem.height * dem.dy);
  const step = 0.0005;
  const grid: GridGeometry = { x0: west, y0: north, dx: step, dy: step, width: Math.ceil((east - west) / step), height: Math.ceil((north - south) / step) };
  const gradient = hornGradient(dem.values, dem);
  const patch = valueNoise(seed + 41, 600, 3);
  // UTM position of every snow-map cell, once for all dates
  const utmX = new Float64Array(grid.width * grid.height);
  const utmY = new Float64Array(grid.width * grid.height);
  const rowCoordinates = gridCoordinateRows(grid, pointTransform(wgs84, dem.crs), dem.dx / 20);
  for (let r = 0; r < grid.height; r++) rowCoordinates(r, utmX.subarray(r * grid.width, (r + 1) * grid.width), utmY.subarray(r * grid.width, (r + 1) * grid.width));
  return SNOW_DATES.map(([date, snowLine, cloudCover], d) => {
    const cloud = valueNoise(seed + 50 + d, 4000, 4);
    const values = new Float32Array(grid.width * grid.height);
    for (let i = 0; i < values.length; i++) {
      const x = utmX[i];
      const y = utmY[i];
      const col = Math.floor((x - dem.x0) / dem.dx);
      const row = Math.floor((dem.y0 - y) / dem.dy);
      if (col < 0 || row < 0 || col >= dem.width || row >= dem.height) { values[i] = 255; continue; }
      const k = row * dem.width + col;
      if (cloud(x, y) > 1 - 2.2 * cloudCover) { values[i] = 2; continue; }
      const northFacing = -gradient.north[k] / Math.max(1e-6, Math.hypot(gradient.east[k], gradient.north[k]));
      values[i] = dem.values[k] + 180 * northFacing + 150 * patch(x, y) > snowLine ? 1 : 0;
    }
    return { date, raster: { ...grid, values, crs: wgs84 } };
  });
}

/** The given glacier elevation change, interpolated linearly in elevation between band mid-points, plus noise; noisy ice-free ground; voids on steep walls. */
function thinningMap(dem: Raster, glacier: Uint8Array, thinning: DemoThinningBand[], seed: number): Raster {
  const mid = thinning.map((b) => (b.lowerM + b.upperM) / 2);
  const rateAt = (z: number) => {
    const k = mid.findIndex((m) => m >= z);
    if (k <= 0) return thinning[k === 0 ? 0 : thinning.length - 1].dhdtMPerYear;
    const w = (z - mid[k - 1]) / (mid[k] - mid[k - 1]);
    return (1 - w) * thinning[k - 1].dhdtMPerYear + w * thinning[k].dhdtMPerYear;
  };
  const factor = 2;
  const grid: GridGeometry = { x0: dem.x0, y0: dem.y0, dx: dem.dx * factor, dy: dem.dy * factor, width: Math.floor(dem.width / factor), height: Math.floor(dem.height / factor) };
  const noise = valueNoise(seed + 61, 800, 3);
  const voids = valueNoise(seed + 67, 400, 2);
  const values = new Float32Array(grid.width * grid.height);
  for (let r = 0; r < grid.height; r++) {
    for (let c = 0; c < grid.width; c++) {
      const k = r * factor * dem.width + c * factor;
      const x = cellCentreX(grid, c);
      const y = cellCentreY(grid, r);
      const z = dem.values[k];
      let v: number;
      if (glacier[k]) {
        v = rateAt(z) + 0.25 * noise(x, y);
      } else {
        v = 0.03 + 0.3 * noise(x, y);
      }
      values[r * grid.width + c] = voids(x, y) > 0.55 ? NaN : v;
    }
  }
  return { ...grid, values, crs: dem.crs };
}
