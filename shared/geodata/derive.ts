import { assignBands, ASPECT_CLASSES, aspectClassIndex, circularMeanAspect, sumUnits, type AspectClass, type UnitSums } from './band-zones';
import { checkElevationValues, checkNodataInside, checkOutlineOnDem, checkResolution } from './dem-checks';
import { GeodataError, percent, type GeodataNotice } from './errors';
import { hypsometry, type HypsometryRow } from './hypsometry';
import { transformOutline, type Outline } from './outline';
import { rasterizePolygons } from './rasterize';
import { cellCentreX, type GridGeometry, type Raster } from './raster';
import { pointTransform, warpRaster } from './reproject';
import { terrainShading } from './sky-view';
import { aspectDeg, hornGradient, type Gradient } from './terrain';
import type { DerivedBand } from './terrain-fields';
import { outlineCentreLonLat, workingDem } from './working-grid';
import type { Crs } from './crs';

export interface DeriveInput {
  /** Elevations in metres (readers convert feet); any supported system. */
  dem: Raster;
  catchment: Outline;
  glaciers?: Outline;
  /** Debris cover; only the part on the glacier counts. */
  debris?: Outline;
  /** Debris thickness in metres, any grid and system. */
  debrisThickness?: Raster;
}

export interface DeriveOptions {
  /** Band height (m), 10–2000; e.g. 100 or 200. */
  bandWidthM: number;
  /** Split each band into north/east/south/west response units. */
  splitByAspect?: boolean;
  /** Azimuth sectors for horizons and sky view (8–72); 0 leaves terrain shading out. Default 36. */
  horizonSectors?: number;
  /** Debris thickness (m) where there is no thickness raster (or it has no data). */
  debrisThicknessM?: number;
  /** Largest share of nodata cells accepted inside the catchment (default 0.1). */
  maxNodataShare?: number;
  /** Earth curvature in horizon searches (default on). */
  curvature?: boolean;
  onProgress?: (fraction: number) => void;
}

/** What a response unit is beyond its table row. */
export interface UnitDetail {
  band: number;
  aspectClass: AspectClass | null;
  cells: number;
  trueAreaKm2: number;
  meanElevationM: number;
  minElevationM: number;
  maxElevationM: number;
  /** Mean resultant length of the cells' aspects: near 0 the mean aspect says little. */
  aspectConsistency: number;
  glacierAreaKm2: number;
  debrisAreaKm2: number;
}

/** The cells behind the bands, for maps and for reducing remote-sensing rasters per band. */
export interface CatchmentZones {
  grid: GridGeometry;
  crs: Crs;
  elevation: Float32Array;
  /** Band of each cell, −1 outside the catchment or without data. */
  band: Int16Array;
  /** Row of `bands` (response unit) of each cell, −1 outside. */
  unit: Int32Array;
  glacier: Uint8Array;
  debris: Uint8Array;
  bandEdgesM: number[];
  /** Planimetric area (m²) of a cell in each column. */
  cellAreaByColumn: Float64Array;
}

export interface DerivedCatchment {
  bands: DerivedBand[];
  units: UnitDetail[];
  hypsometry: HypsometryRow[];
  summary: {
    areaKm2: number;
    trueAreaKm2: number;
    glacierAreaKm2: number;
    debrisAreaKm2: number;
    minElevationM: number;
    maxElevationM: number;
    cellSizeM: number;
    workingCrs: string;
    centreLonLat: [number, number];
    nodataShare: number;
  };
  notices: GeodataNotice[];
  zones: CatchmentZones;
}

/**
 * Bands (or response units) from a DEM and outlines: checks the inputs, brings everything onto one
 * metric grid, rasterises the outlines (cell centres, as gdal_rasterize), derives slope and aspect
 * by Horn's method and sums per band; optionally horizons and the sky-view factor. Throws a
 * `GeodataError` for input it cannot use; everything doubtful but usable is in `notices`.
 */
export function deriveCatchment(input: DeriveInput, options: DeriveOptions): DerivedCatchment {
  const notices: GeodataNotice[] = [];
  checkOptions(options, input);
  checkElevationValues(input.dem);
  checkOutlineOnDem(input.catchment, input.dem, 'catchmentOutline', notices);
  const dem = workingDem(input.dem, input.catchment);
  const progress = options.onProgress ?? (() => {});
  const inGrid = (o: Outline) => rasterizePolygons(transformOutline(o, pointTransform(o.crs, dem.crs), dem.crs).polygons, dem);
  const catchment = inGrid(input.catchment);
  const { missing, total } = checkNodataInside(dem.values, catchment, dem, options.maxNodataShare ?? 0.1, notices);
  checkResolution(dem.values, catchment, dem, options.bandWidthM);
  const glacier = input.glaciers ? inGrid(input.glaciers) : new Uint8Array(catchment.length);
  const debrisOutline = input.debris ? inGrid(input.debris) : new Uint8Array(catchment.length);
  const debris = onGlacierOnly(debrisOutline, glacier, catchment, notices);
  const thickness = input.debrisThickness ? warpRaster(input.debrisThickness, dem, dem.crs, 'bilinear').values : null;
  const gradient = hornGradient(dem.values, dem);
  const { edges, band } = assignBands(dem.values, catchment, options.bandWidthM);
  const split = options.splitByAspect ?? false;
  const rawUnit = unitsOfCells(band, gradient, split);
  const cellAreaByColumn = cellAreas(dem);
  const rawCount = (edges.length - 1) * (split ? 4 : 1);
  const sums = sumUnits({ z: dem.values, grid: dem, gradient, unit: rawUnit, unitCount: rawCount, glacier, debris, thickness, cellAreaByColumn });
  const { unit, keep } = dropEmptyUnits(rawUnit, sums, rawCount);
  progress(0.1);
  const sectors = options.horizonSectors ?? 36;
  const shading = sectors > 0
    ? terrainShading(dem.values, dem, gradient, unit, keep.length, sectors, {
      curvature: options.curvature, onSector: (k) => progress(0.1 + (0.9 * (k + 1)) / sectors),
    })
    : null;
  const fallbackThickness = catchmentThickness(sums, options.debrisThicknessM);
  const bands: DerivedBand[] = [];
  const units: UnitDetail[] = [];
  keep.forEach((raw, row) => {
    const b = split ? Math.floor(raw / 4) : raw;
    const unitRow = bandRow(sums, raw, edges[b], edges[b + 1], fallbackThickness, shading ? { svf: shading.skyViewFactor[row], horizon: shading.horizonDeg[row] } : null);
    // A response unit says which aspect class of its band it is (the band table stores units as rows sharing a range).
    bands.push(split ? { ...unitRow, aspectClass: ASPECT_CLASSES[raw % 4] } : unitRow);
    units.push(unitDetail(sums, raw, b, split ? ASPECT_CLASSES[raw % 4] : null));
  });
  warnSmallUnits(units, notices);
  progress(1);
  const sum = (a: Float64Array) => a.reduce((x, y) => x + y, 0);
  return {
    bands,
    units,
    hypsometry: hypsometry(dem.values, band, glacier, debris, cellAreaByColumn, dem.width, Math.min(50, options.bandWidthM)),
    summary: {
      areaKm2: sum(sums.areaM2) / 1e6,
      trueAreaKm2: sum(sums.trueAreaM2) / 1e6,
      glacierAreaKm2: sum(sums.glacierM2) / 1e6,
      debrisAreaKm2: sum(sums.debrisM2) / 1e6,
      minElevationM: Math.min(...sums.minM),
      maxElevationM: Math.max(...sums.maxM),
      cellSizeM: dem.dx,
      workingCrs: dem.crs.name,
      centreLonLat: outlineCentreLonLat(input.catchment),
      nodataShare: missing / total,
    },
    notices,
    zones: { grid: { width: dem.width, height: dem.height, x0: dem.x0, y0: dem.y0, dx: dem.dx, dy: dem.dy }, crs: dem.crs, elevation: dem.values, band, unit, glacier, debris, bandEdgesM: edges, cellAreaByColumn },
  };
}

function checkOptions(options: DeriveOptions, input: DeriveInput): void {
  const w = options.bandWidthM;
  if (!Number.isFinite(w) || w < 10 || w > 2000) throw new GeodataError('bad_option', 'The band width must be between 10 and 2000 m.', 'bandWidthM');
  const s = options.horizonSectors;
  if (s !== undefined && s !== 0 && (!Number.isInteger(s) || s < 8 || s > 72)) {
    throw new GeodataError('bad_option', 'The number of horizon directions must be a whole number from 8 to 72 (or 0 for none).', 'horizonSectors');
  }
  const h = options.debrisThicknessM;
  if (h !== undefined && (!Number.isFinite(h) || h < 0 || h > 10)) throw new GeodataError('bad_option', 'The debris thickness must be between 0 and 10 m.', 'debrisThicknessM');
  if (input.debris && !input.debrisThickness && h === undefined) {
    throw new GeodataError('bad_option', 'A debris-cover outline needs a debris thickness: upload a thickness raster or give one thickness in metres.', 'debrisThicknessM');
  }
}

/** Debris counts only on the glacier inside the catchment (the engine's debris fraction is of the glacier). */
function onGlacierOnly(debris: Uint8Array, glacier: Uint8Array, catchment: Uint8Array, notices: GeodataNotice[]): Uint8Array {
  let inside = 0;
  let off = 0;
  const out = new Uint8Array(debris.length);
  for (let i = 0; i < debris.length; i++) {
    if (!debris[i] || !catchment[i]) continue;
    if (glacier[i]) { out[i] = 1; inside++; } else off++;
  }
  if (off > 0) {
    notices.push({ code: 'debris_off_glacier', field: 'debrisOutline', message: `${percent(off / (off + inside))} of the debris cover inside the catchment lies off the glacier outline and is not counted as debris-covered ice.` });
  }
  return out;
}

function unitsOfCells(band: Int16Array, gradient: Gradient, split: boolean): Int32Array {
  const unit = new Int32Array(band.length).fill(-1);
  for (let i = 0; i < band.length; i++) {
    if (band[i] < 0) continue;
    unit[i] = split ? band[i] * 4 + aspectClassIndex(aspectDeg(gradient.east[i], gradient.north[i])) : band[i];
  }
  return unit;
}

function dropEmptyUnits(raw: Int32Array, sums: UnitSums, count: number): { unit: Int32Array; keep: number[] } {
  const keep: number[] = [];
  const index = new Int32Array(count).fill(-1);
  for (let u = 0; u < count; u++) if (sums.cells[u] > 0) { index[u] = keep.length; keep.push(u); }
  const unit = new Int32Array(raw.length);
  for (let i = 0; i < raw.length; i++) unit[i] = raw[i] < 0 ? -1 : index[raw[i]];
  return { unit, keep };
}

/**
 * Planimetric cell areas per column. On UTM the grid is true to scale only near the central
 * meridian; the point scale factor k = k0 (1 + x²/2R² + x⁴/24R⁴), x = (E − 500 km)/k0 (Snyder
 * 1987, eq. 8-11 simplified [memory]) shrinks each cell to its area on the ellipsoid by 1/k².
 */
function cellAreas(grid: Raster): Float64Array {
  const areas = new Float64Array(grid.width).fill(grid.dx * grid.dy);
  if (!/\+proj=utm/.test(grid.crs.proj4)) return areas;
  const k0 = 0.9996;
  const r = 6_371_000;
  for (let col = 0; col < grid.width; col++) {
    const x = (cellCentreX(grid, col) - 500_000) / k0;
    const q = (x * x) / (r * r);
    const k = k0 * (1 + q / 2 + (q * q) / 24);
    areas[col] /= k * k;
  }
  return areas;
}

function catchmentThickness(sums: UnitSums, userValue: number | undefined): number {
  if (userValue !== undefined) return userValue;
  const area = sums.thicknessM2.reduce((a, b) => a + b, 0);
  return area > 0 ? sums.thicknessArea.reduce((a, b) => a + b, 0) / area : 0;
}

const round = (v: number, digits: number) => Math.round(v * 10 ** digits) / 10 ** digits;

function bandRow(s: UnitSums, u: number, lowerM: number, upperM: number, fallbackThickness: number, shading: { svf: number; horizon: number[][] } | null): DerivedBand {
  const area = s.areaM2[u];
  const { aspectDeg: aspect } = circularMeanAspect(s.aspectSin[u], s.aspectCos[u], s.aspectWeight[u]);
  const glacierFraction = Math.min(1, s.glacierM2[u] / area);
  const debrisFraction = s.glacierM2[u] > 0 ? Math.min(1, s.debrisM2[u] / s.glacierM2[u]) : 0;
  const thickness = debrisFraction > 0 ? (s.thicknessM2[u] > 0 ? s.thicknessArea[u] / s.thicknessM2[u] : fallbackThickness) : 0;
  const row: DerivedBand = {
    lowerM,
    upperM,
    areaKm2: Math.max(1e-4, round(area / 1e6, 4)),
    slopeDeg: round(Math.min(89, s.slopeDegArea[u] / area), 1),
    aspectDeg: round(aspect, 1) % 360,
    glacierFraction: round(glacierFraction, 3),
    debrisFraction: round(debrisFraction, 3),
    debrisThicknessM: round(thickness, 3),
  };
  if (shading) {
    row.skyViewFactor = round(shading.svf, 4);
    row.horizonDeg = shading.horizon;
  }
  return row;
}

function unitDetail(s: UnitSums, u: number, band: number, aspectClass: AspectClass | null): UnitDetail {
  const area = s.areaM2[u];
  return {
    band,
    aspectClass,
    cells: s.cells[u],
    trueAreaKm2: round(s.trueAreaM2[u] / 1e6, 4),
    meanElevationM: round(s.elevationArea[u] / area, 1),
    minElevationM: round(s.minM[u], 1),
    maxElevationM: round(s.maxM[u], 1),
    aspectConsistency: round(circularMeanAspect(s.aspectSin[u], s.aspectCos[u], s.aspectWeight[u]).consistency, 3),
    glacierAreaKm2: round(s.glacierM2[u] / 1e6, 4),
    debrisAreaKm2: round(s.debrisM2[u] / 1e6, 4),
  };
}

/** Bands resting on a handful of cells give noisy slopes and fractions: say which. */
function warnSmallUnits(units: UnitDetail[], notices: GeodataNotice[]): void {
  const small = units.filter((u) => u.cells < 25);
  if (small.length > 0) {
    notices.push({ code: 'few_cells', field: 'bandWidthM', message: `${small.length} band(s) rest on fewer than 25 DEM cells; their slope, aspect and fractions are uncertain.` });
  }
}
