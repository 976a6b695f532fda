import { HydrologyInputError, refuse, type HydrologyIssue } from './errors';

/** What this folder needs of an elevation band (a subset of the engine's band). */
export interface ElevationBand {
  /** Lower and upper elevation, m a.s.l. */
  lowerM: number;
  upperM: number;
  /** Horizontal area, km². */
  areaKm2: number;
}

/** Monthly climatology of one station over the common period of the stations being compared. */
export interface StationClimate {
  /** Shown in messages. */
  name: string;
  /** m a.s.l. */
  elevationM: number;
  /** Monthly mean air temperature, °C, January first; null for a month without enough data. */
  monthlyTemperatureC?: readonly (number | null)[];
  /** Monthly precipitation, mm per month (any unit, the same at every station), January first; null where missing. */
  monthlyPrecipitationMm?: readonly (number | null)[];
}

export const MONTHS = 12;
export const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'] as const;

/** Mid-elevation of a band, m. */
export function bandMidM(band: ElevationBand): number {
  return (band.lowerM + band.upperM) / 2;
}

/** Lowest and highest elevation of the bands, m. */
export function catchmentRange(bands: readonly ElevationBand[]): { bottomM: number; topM: number } {
  if (bands.length === 0) refuse('bands', 'the catchment has no elevation bands.');
  return { bottomM: Math.min(...bands.map((b) => b.lowerM)), topM: Math.max(...bands.map((b) => b.upperM)) };
}

function checkSeries(values: readonly (number | null)[] | undefined, path: string, min: number, max: number, unit: string, issues: HydrologyIssue[]): void {
  if (values === undefined) return;
  if (values.length !== MONTHS) {
    issues.push({ path, message: `has ${values.length} monthly values; it needs 12 (January first).` });
    return;
  }
  values.forEach((v, m) => {
    if (v !== null && !(Number.isFinite(v) && v >= min && v <= max)) issues.push({ path: `${path}[${m}]`, message: `${v} ${unit} is outside ${min} … ${max} ${unit}.` });
  });
}

/**
 * Checks stations before any fit: names, elevations inside the catchment's range of bands
 * (a station above the catchment's top cannot stand for any band; one below its bottom is
 * accepted, valley stations often sit just below the outlet), and monthly values in plausible ranges.
 * @throws HydrologyInputError naming every problem (e.g. `stations[2].elevationM`)
 * @example checkStations([{ name: 'Summit Mast', elevationM: 6100 }], [{ lowerM: 2000, upperM: 5900, areaKm2: 40 }]) // throws: stations[0].elevationM: station “Summit Mast” at 6100 m lies above the catchment's top (5900 m).
 */
export function checkStations(stations: readonly StationClimate[], bands: readonly ElevationBand[]): void {
  const { topM } = catchmentRange(bands);
  const issues: HydrologyIssue[] = [];
  if (stations.length === 0) issues.push({ path: 'stations', message: 'at least one station is needed.' });
  stations.forEach((s, i) => {
    const at = `stations[${i}]`;
    if (!s.name || !s.name.trim()) issues.push({ path: `${at}.name`, message: 'every station needs a name.' });
    if (!Number.isFinite(s.elevationM)) issues.push({ path: `${at}.elevationM`, message: `station “${s.name}” has no elevation.` });
    else if (s.elevationM > topM) issues.push({ path: `${at}.elevationM`, message: `station “${s.name}” at ${s.elevationM} m lies above the catchment's top (${topM} m).` });
    // Plausible surface ranges: the world's extremes of monthly means and monthly totals, with margin.
    checkSeries(s.monthlyTemperatureC, `${at}.monthlyTemperatureC`, -60, 45, '°C', issues);
    checkSeries(s.monthlyPrecipitationMm, `${at}.monthlyPrecipitationMm`, 0, 5000, 'mm', issues);
  });
  if (issues.length > 0) throw new HydrologyInputError(issues);
}
