import { addDays } from './calendar';
import type { SimulationResult } from './result';

/** One band in one calendar month; depths mm w.e. over the band area, volumes m³. */
export interface BandMonthSummary {
  bandIndex: number;
  /** YYYY-MM */
  month: string;
  days: number;
  snowMeltMm: number;
  iceMeltMm: number;
  debrisIceMeltMm: number;
  rainMm: number;
  snowfallMm: number;
  runoffMm: number;
  snowMeltM3: number;
  iceMeltM3: number;
  debrisIceMeltM3: number;
  rainM3: number;
  runoffM3: number;
  /** Shortwave-weighted mean albedo of the snow and ice surfaces; null when the month had none in daylight. */
  meanAlbedo: number | null;
  /** Mean shortwave absorbed by snow and ice per m² of band, W m⁻². */
  meanAbsorbedShortwaveWm2: number;
  rainfallMm: number;
  /** Snow melted at the surface before retention and refreezing. */
  surfaceMeltMm: number;
  refrozenMm: number;
  /** Net losses to the air (negative: deposition, condensation). */
  sublimationMm: number;
  evaporationMm: number;
  /** Mean snow-covered share of the band. */
  meanSnowCoverFraction: number;
  /** Snow the band gained (+) or lost (−) by wind drift and by avalanching (0 when off). */
  windDriftMm: number;
  avalancheMm: number;
}

const SUMMED = ['snowMeltMm', 'iceMeltMm', 'debrisIceMeltMm', 'rainMm', 'snowfallMm', 'rainfallMm', 'surfaceMeltMm', 'refrozenMm', 'sublimationMm', 'evaporationMm', 'windDriftMm', 'avalancheMm'] as const;

/**
 * Per band × calendar month totals by source, with mean albedo, absorbed shortwave and snow
 * cover — the figures a run stores. Rows are ordered by band, then month.
 */
export function summariseByMonth(result: SimulationResult): BandMonthSummary[] {
  const { dayCount: nd, bandCount, bandDay, bands, startDate } = result;
  const monthOf = Array.from({ length: nd }, (_, d) => addDays(startDate, d).slice(0, 7));
  const rows: BandMonthSummary[] = [];
  for (let b = 0; b < bandCount; b++) {
    let row: BandMonthSummary | null = null;
    let albedoWeight = 0;
    let albedoSum = 0;
    const close = () => {
      if (!row) return;
      row.meanAlbedo = albedoWeight > 0 ? albedoSum / albedoWeight : null;
      row.meanAbsorbedShortwaveWm2 /= row.days;
      row.meanSnowCoverFraction /= row.days;
      rows.push(row);
    };
    for (let d = 0; d < nd; d++) {
      if (!row || row.month !== monthOf[d]) {
        close();
        row = {
          bandIndex: b, month: monthOf[d], days: 0, snowMeltMm: 0, iceMeltMm: 0, debrisIceMeltMm: 0, rainMm: 0, snowfallMm: 0,
          runoffMm: 0, snowMeltM3: 0, iceMeltM3: 0, debrisIceMeltM3: 0, rainM3: 0, runoffM3: 0, meanAlbedo: null, meanAbsorbedShortwaveWm2: 0,
          rainfallMm: 0, surfaceMeltMm: 0, refrozenMm: 0, sublimationMm: 0, evaporationMm: 0, meanSnowCoverFraction: 0, windDriftMm: 0, avalancheMm: 0,
        };
        albedoWeight = 0;
        albedoSum = 0;
      }
      const i = b * nd + d;
      row.days += 1;
      for (const field of SUMMED) row[field] += bandDay[field][i];
      row.meanAbsorbedShortwaveWm2 += bandDay.absorbedShortwaveWm2[i];
      row.meanSnowCoverFraction += bandDay.snowCoverFraction[i];
      const incoming = bandDay.incomingShortwaveWm2[i];
      if (bandDay.albedo[i] > 0 && incoming > 0) {
        albedoSum += bandDay.albedo[i] * incoming;
        albedoWeight += incoming;
      }
    }
    close();
  }
  for (const row of rows) {
    const m3PerMm = bands.areaM2[row.bandIndex] / 1000;
    row.runoffMm = row.snowMeltMm + row.iceMeltMm + row.debrisIceMeltMm + row.rainMm;
    row.snowMeltM3 = row.snowMeltMm * m3PerMm;
    row.iceMeltM3 = row.iceMeltMm * m3PerMm;
    row.debrisIceMeltM3 = row.debrisIceMeltMm * m3PerMm;
    row.rainM3 = row.rainMm * m3PerMm;
    row.runoffM3 = row.runoffMm * m3PerMm;
  }
  return rows;
}
