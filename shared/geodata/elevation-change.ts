import type { CatchmentZones } from './derive';
import { GeodataError, type GeodataNotice } from './errors';
import type { Raster } from './raster';
import { sampleAtZones } from './zone-sampling';

/** Volume-to-mass conversion density and its uncertainty, Huss (2013, The Cryosphere 7:877): 850 ± 60 kg m⁻³. */
export const HUSS_DENSITY = { valueKgM3: 850, sigmaKgM3: 60 } as const;
const WATER_DENSITY = 1000;
/** NMAD = 1.4826 × median absolute deviation, a robust standard deviation of DEM differences (Höhle & Höhle 2009 [memory]). */
const NMAD_FACTOR = 1.4826;
const DAYS_PER_YEAR = 365.25;

export type ElevationChangeSource =
  | { kind: 'rate'; dhdt: Raster }
  | { kind: 'two-dems'; before: Raster; after: Raster; beforeDate: string; afterDate: string };

export interface ElevationChangeOptions {
  densityKgM3?: number;
  densitySigmaKgM3?: number;
  /** Spatial correlation length of DEM-difference errors (m), for the error of band means (default 500 m). */
  correlationLengthM?: number;
}

export interface ElevationChangeRow {
  band: number | null;
  lowerM: number;
  upperM: number;
  glacierAreaKm2: number;
  /** Share of the glacier area with a valid elevation change. */
  coveredFraction: number;
  dhdtMPerYear: number | null;
  dhdtSigmaMPerYear: number | null;
  balanceMwePerYear: number | null;
  balanceSigmaMwePerYear: number | null;
}

/**
 * Geodetic mass balance per band: mean elevation change rate over the glacier cells of each band
 * (cells without data are left out, which fills them with the band mean, common practice for
 * hypsometric void filling), converted with ρ/ρw, ρ = 850 ± 60 kg m⁻³ (Huss 2013). Errors:
 * the off-glacier ("stable") catchment cells give a robust spread (NMAD) and bias (median) of the
 * differences; a band mean's random error is NMAD·√(πL²/5A) for an area A larger than the
 * correlation disc (Rolstad et al. 2009 [memory]), the stable-ground median is added as a
 * systematic error, and σB² = (ḣ σρ/ρw)² + (ρ σḣ/ρw)² (Gaussian propagation).
 */
export function elevationChangeByBand(source: ElevationChangeSource, zones: CatchmentZones, options: ElevationChangeOptions = {}): { rows: ElevationChangeRow[]; glacier: ElevationChangeRow; stable: { medianMPerYear: number; nmadMPerYear: number; cells: number } | null; years: number | null; notices: GeodataNotice[] } {
  const notices: GeodataNotice[] = [];
  const { rate, years } = rateAtZones(source, zones, notices);
  const rho = options.densityKgM3 ?? HUSS_DENSITY.valueKgM3;
  const sigmaRho = options.densitySigmaKgM3 ?? HUSS_DENSITY.sigmaKgM3;
  const corr = options.correlationLengthM ?? 500;
  const bandCount = zones.bandEdgesM.length - 1;
  const area = new Float64Array(bandCount + 1);
  const covered = new Float64Array(bandCount + 1);
  const sum = new Float64Array(bandCount + 1);
  const stableValues: number[] = [];
  const { width } = zones.grid;
  for (let i = 0; i < rate.length; i++) {
    const b = zones.band[i];
    if (b < 0) continue;
    const v = rate[i];
    if (!zones.glacier[i]) { if (v === v) stableValues.push(v); continue; }
    const a = zones.cellAreaByColumn[i % width];
    for (const k of [b, bandCount]) {
      area[k] += a;
      if (v === v) { covered[k] += a; sum[k] += a * v; }
    }
  }
  if (area[bandCount] === 0) throw new GeodataError('no_overlap', 'The catchment has no glacier area, so there is no glacier elevation change to reduce.', 'glacierOutline');
  if (covered[bandCount] === 0) throw new GeodataError('no_overlap', 'The elevation-change data do not cover the glacier (every glacier cell is outside them or nodata).', 'elevationChange');
  const stable = stableStatistics(stableValues);
  if (!stable) notices.push({ code: 'no_stable_ground', field: 'elevationChange', message: 'No ice-free ground inside the catchment has elevation-change data, so the error of the DEM difference cannot be estimated; uncertainties include the density only.' });
  else if (Math.abs(stable.medianMPerYear) > 0.2) {
    notices.push({ code: 'stable_ground_bias', field: 'elevationChange', message: `Ice-free ground changes by ${stable.medianMPerYear.toFixed(2)} m per year (median), which points to DEMs that are not co-registered; it is counted as a systematic error.` });
  }
  const row = (k: number, band: number | null, lowerM: number, upperM: number): ElevationChangeRow => {
    const areaM2 = covered[k];
    if (areaM2 === 0) return { band, lowerM, upperM, glacierAreaKm2: area[k] / 1e6, coveredFraction: 0, dhdtMPerYear: null, dhdtSigmaMPerYear: null, balanceMwePerYear: null, balanceSigmaMwePerYear: null };
    const dhdt = sum[k] / areaM2;
    const randomShare = Math.sqrt(Math.min(1, (Math.PI * corr * corr) / (5 * areaM2)));
    const sigmaDh = stable ? Math.hypot(stable.nmadMPerYear * randomShare, stable.medianMPerYear) : 0;
    const balance = (dhdt * rho) / WATER_DENSITY;
    const sigmaB = Math.hypot((dhdt * sigmaRho) / WATER_DENSITY, (rho * sigmaDh) / WATER_DENSITY);
    return { band, lowerM, upperM, glacierAreaKm2: area[k] / 1e6, coveredFraction: areaM2 / area[k], dhdtMPerYear: dhdt, dhdtSigmaMPerYear: sigmaDh, balanceMwePerYear: balance, balanceSigmaMwePerYear: sigmaB };
  };
  const rows = Array.from({ length: bandCount }, (_, b) => row(b, b, zones.bandEdgesM[b], zones.bandEdgesM[b + 1])).filter((r) => r.glacierAreaKm2 > 0);
  return { rows, glacier: row(bandCount, null, zones.bandEdgesM[0], zones.bandEdgesM[bandCount]), stable, years, notices };
}

function rateAtZones(source: ElevationChangeSource, zones: CatchmentZones, notices: GeodataNotice[]): { rate: Float32Array; years: number | null } {
  if (source.kind === 'rate') return { rate: sampleAtZones(zones, source.dhdt, 'bilinear'), years: null };
  const t0 = Date.parse(`${source.beforeDate}T00:00:00Z`);
  const t1 = Date.parse(`${source.afterDate}T00:00:00Z`);
  if (!Number.isFinite(t0) || !Number.isFinite(t1) || t1 <= t0) {
    throw new GeodataError('bad_option', 'The second DEM must be dated after the first (dates written YYYY-MM-DD).', 'afterDate');
  }
  const years = (t1 - t0) / (DAYS_PER_YEAR * 86_400_000);
  if (years < 5) {
    notices.push({ code: 'short_period', field: 'afterDate', message: `The DEMs are ${years.toFixed(1)} years apart; the 850 kg m⁻³ conversion is meant for periods of about five years or more (Huss 2013), so treat the balance with care.` });
  }
  const before = sampleAtZones(zones, source.before, 'bilinear');
  const after = sampleAtZones(zones, source.after, 'bilinear');
  const rate = new Float32Array(before.length);
  for (let i = 0; i < rate.length; i++) rate[i] = (after[i] - before[i]) / years;
  return { rate, years };
}

function stableStatistics(values: number[]): { medianMPerYear: number; nmadMPerYear: number; cells: number } | null {
  if (values.length < 10) return null;
  const sorted = Float64Array.from(values).sort();
  const median = sorted[Math.floor(sorted.length / 2)];
  const deviations = sorted.map((v) => Math.abs(v - median)).sort();
  return { medianMPerYear: median, nmadMPerYear: NMAD_FACTOR * deviations[Math.floor(deviations.length / 2)], cells: values.length };
}
