import type { SimulationResult } from './result';

/**
 * The water balance of one band over a run, mm w.e. over the band:
 *   in:  snowfall + rainfall + glacier ice lost (melt under snow-free ice and debris, and vapour
 *        lost from ice) + snow brought by redistribution (wind drift and avalanches; negative
 *        where the band lost snow to others)
 *   out: runoff (snowmelt, ice melt, melt under debris, rain) + sublimation + evaporation
 *   storage: change of the pack's water, solid and liquid
 * `residual` = in − out − storage is 0 up to rounding (tested to 10⁻⁹ relative).
 */
export interface BandWaterBalance {
  precipitationMm: number;
  glacierIceLossMm: number;
  /** Snow gained (+) or lost (−) by wind drift and avalanching. */
  redistributedMm: number;
  runoffMm: number;
  vapourLossMm: number;
  storageChangeMm: number;
  residualMm: number;
}

export function bandWaterBalance(result: SimulationResult, band: number): BandWaterBalance {
  const t = result.bandTotals;
  const precipitationMm = t.snowfallMm[band] + t.rainfallMm[band];
  const glacierIceLossMm = t.iceMeltMm[band] + t.debrisIceMeltMm[band] + t.iceVapourLossMm[band];
  const redistributedMm = t.windDriftMm[band] + t.avalancheMm[band];
  const runoffMm = t.runoffMm[band];
  const vapourLossMm = t.sublimationMm[band] + t.evaporationMm[band];
  const storageChangeMm = t.sweEndMm[band] - t.sweStartMm[band];
  return {
    precipitationMm, glacierIceLossMm, redistributedMm, runoffMm, vapourLossMm, storageChangeMm,
    residualMm: precipitationMm + glacierIceLossMm + redistributedMm - runoffMm - vapourLossMm - storageChangeMm,
  };
}
