/** Result of a run. Per band per day arrays are band-major: value of band b on day d is at b·dayCount + d. */

import type { StartReport } from './spin-up';
import type { EngineState } from './state-schema';
import type { ShortwaveSource } from './schema';

/**
 * Per band per day. Runoff by source (mm w.e. over the band): snowMeltMm (snowmelt that drained
 * from the pack), iceMeltMm, debrisIceMeltMm, rainMm (rain that ran off, directly or through the
 * pack). Mass: snowfallMm, rainfallMm; sweMm and liquidWaterMm at the end of the day (sweMm
 * includes the liquid water held in the pack); surfaceMeltMm (snow melted at the surface, before
 * retention and refreezing), refrozenMm; sublimationMm and evaporationMm (net losses to the air,
 * negative for deposition and condensation), of which iceVapourLossMm came from glacier ice.
 * Energy: daily means over the band's snow and ice surfaces (W m⁻²); absorbedShortwaveWm2 per m²
 * of band; albedo shortwave-weighted. snowCoverFraction is the daily mean snow-covered share of
 * the band; debrisSurfaceMaxC the day's highest debris surface temperature (0 when no debris was
 * exposed); airTemperatureC the day's mean air temperature at the band's mean elevation.
 * Redistribution: windDriftMm and avalancheMm, the snow the band gained (+) or lost (−) that day by
 * wind drift and by avalanching (0 when off); area-weighted they sum to 0 over the catchment.
 */
export const BAND_DAY_FIELDS = [
  'snowMeltMm', 'iceMeltMm', 'debrisIceMeltMm', 'rainMm', 'snowfallMm', 'sweMm', 'albedo',
  'incomingShortwaveWm2', 'netShortwaveWm2', 'absorbedShortwaveWm2', 'netLongwaveWm2', 'sensibleHeatWm2',
  'rainfallMm', 'liquidWaterMm', 'surfaceMeltMm', 'refrozenMm', 'sublimationMm', 'evaporationMm', 'iceVapourLossMm',
  'latentHeatWm2', 'snowCoverFraction', 'debrisSurfaceMaxC', 'airTemperatureC', 'windDriftMm', 'avalancheMm',
] as const;
export type BandDayField = (typeof BAND_DAY_FIELDS)[number];

/** Where runoff comes from: snowmelt, clean-ice melt, melt under debris, rain. */
export const SOURCES = ['snow', 'ice', 'debrisIce', 'rain'] as const;
export type Source = (typeof SOURCES)[number];
export const SOURCE_FIELD: Record<Source, BandDayField> = {
  snow: 'snowMeltMm', ice: 'iceMeltMm', debrisIce: 'debrisIceMeltMm', rain: 'rainMm',
};

export const BAND_TOTAL_FIELDS = [
  'snowMeltMm', 'iceMeltMm', 'debrisIceMeltMm', 'rainMm', 'snowfallMm', 'runoffMm', 'sweStartMm', 'sweEndMm',
  'rainfallMm', 'surfaceMeltMm', 'refrozenMm', 'sublimationMm', 'evaporationMm', 'iceVapourLossMm', 'windDriftMm', 'avalancheMm',
] as const;

/** Band totals summed from the per-day field of the same name. */
const SUMMED_FIELDS = ['snowfallMm', 'rainfallMm', 'surfaceMeltMm', 'refrozenMm', 'sublimationMm', 'evaporationMm', 'iceVapourLossMm', 'windDriftMm', 'avalancheMm'] as const;
export type BandTotalField = (typeof BAND_TOTAL_FIELDS)[number];

export type MeltModel = 'energy-balance' | 'degree-day' | 'enhanced-temperature-index';

export interface BandInfo {
  elevationM: Float64Array;
  areaM2: Float64Array;
  cleanIceAreaM2: Float64Array;
  debrisAreaM2: Float64Array;
  debrisThicknessM: Float64Array;
}

export interface SimulationResult {
  engineVersion: string;
  model: MeltModel;
  /** First simulated local date, YYYY-MM-DD; day d is startDate + d days. */
  startDate: string;
  dayCount: number;
  bandCount: number;
  layout: 'band-major';
  /**
   * Per band per day. Depths (mm w.e.) are over the whole band area, so a band's sources add up
   * to its runoff depth. Energy fluxes (W m⁻², daily means) are over the band's snow and ice
   * surfaces only; absorbedShortwaveWm2 is the shortwave absorbed by snow and ice per m² of band.
   * albedo is the shortwave-weighted mean of the snow and ice surfaces (0 when there are none).
   */
  bandDay: Record<BandDayField, Float64Array>;
  /**
   * Catchment daily volume (m³) and mean discharge (m³ s⁻¹) by source and in total: the runoff as
   * it leaves the snow, ice and ground surface of the bands (unrouted). With routing on, `routed`
   * is the outlet's: the same sources after the linear reservoirs (from the start of the spin-up);
   * null without routing, when the outlet discharge is the unrouted total.
   */
  catchmentDaily: {
    volumeM3: Record<Source | 'total', Float64Array>;
    dischargeM3s: Record<Source | 'total', Float64Array>;
    routed: { volumeM3: Record<Source | 'total', Float64Array>; dischargeM3s: Record<Source | 'total', Float64Array> } | null;
  };
  /** Per band totals over the run, mm w.e. over the band area; runoff = all melt + rain. */
  bandTotals: Record<BandTotalField, Float64Array>;
  bands: BandInfo;
  /** How the run started: spin-up (from the record or a repeated first year), initial SWE or a state. */
  start: StartReport;
  /** Where the shortwave came from. */
  shortwaveSource: ShortwaveSource;
  /** The state at the end of the period, to start a later run from. */
  endState: EngineState;
}

function record<K extends string>(keys: readonly K[], length: number): Record<K, Float64Array> {
  return Object.fromEntries(keys.map((k) => [k, new Float64Array(length)])) as Record<K, Float64Array>;
}

export interface RunDescription {
  start: StartReport;
  shortwaveSource: ShortwaveSource;
}

export function allocateResult(model: MeltModel, engineVersion: string, startDate: string, dayCount: number, bands: BandInfo, description: RunDescription): SimulationResult {
  const bandCount = bands.areaM2.length;
  const totalKeys = [...SOURCES, 'total'] as const;
  return {
    engineVersion, model, startDate, dayCount, bandCount, layout: 'band-major',
    bandDay: record(BAND_DAY_FIELDS, bandCount * dayCount),
    catchmentDaily: { volumeM3: record(totalKeys, dayCount), dischargeM3s: record(totalKeys, dayCount), routed: null },
    bandTotals: record(BAND_TOTAL_FIELDS, bandCount),
    bands,
    start: description.start,
    shortwaveSource: description.shortwaveSource,
    endState: {} as EngineState,
  };
}

/** Fills catchment daily series and band totals from the per band per day arrays; `initialSweMm` is the pack water at the period's start. */
export function summarise(result: SimulationResult, initialSweMm: Float64Array): void {
  const { dayCount, bandCount, bandDay, catchmentDaily, bandTotals, bands } = result;
  for (const source of SOURCES) {
    const depth = bandDay[SOURCE_FIELD[source]];
    const volume = catchmentDaily.volumeM3[source];
    for (let b = 0; b < bandCount; b++) {
      const m3PerMm = bands.areaM2[b] / 1000;
      let sum = 0;
      for (let d = 0; d < dayCount; d++) {
        const mm = depth[b * dayCount + d];
        volume[d] += mm * m3PerMm;
        sum += mm;
      }
      bandTotals[SOURCE_FIELD[source] as BandTotalField][b] = sum;
      bandTotals.runoffMm[b] += sum;
    }
  }
  for (const field of SUMMED_FIELDS) {
    const values = bandDay[field];
    for (let b = 0; b < bandCount; b++) {
      let sum = 0;
      for (let d = 0; d < dayCount; d++) sum += values[b * dayCount + d];
      bandTotals[field][b] = sum;
    }
  }
  for (let b = 0; b < bandCount; b++) {
    bandTotals.sweStartMm[b] = initialSweMm[b];
    bandTotals.sweEndMm[b] = dayCount > 0 ? bandDay.sweMm[b * dayCount + dayCount - 1] : initialSweMm[b];
  }
  const total = catchmentDaily.volumeM3.total;
  for (const source of SOURCES) {
    const volume = catchmentDaily.volumeM3[source];
    const discharge = catchmentDaily.dischargeM3s[source];
    for (let d = 0; d < dayCount; d++) {
      total[d] += volume[d];
      discharge[d] = volume[d] / 86400;
    }
  }
  for (let d = 0; d < dayCount; d++) catchmentDaily.dischargeM3s.total[d] = total[d] / 86400;
}
