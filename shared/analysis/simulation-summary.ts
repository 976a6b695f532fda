import { addDays } from '../melt/calendar';
import { summariseByMonth, type BandMonthSummary } from '../melt/monthly';
import { SOURCES, type SimulationResult, type Source } from '../melt/result';
import type { ShortwaveSource } from '../melt/schema';
import type { StartReport } from '../melt/spin-up';

/** One band in one calendar month of one simulation: what a run stores (depths mm w.e. over the band). */
export type BandMonthRow = Pick<
  BandMonthSummary,
  'bandIndex' | 'month' | 'days' | 'snowMeltMm' | 'iceMeltMm' | 'debrisIceMeltMm' | 'rainMm' | 'snowfallMm' | 'meanAlbedo'
  | 'rainfallMm' | 'surfaceMeltMm' | 'refrozenMm' | 'sublimationMm' | 'evaporationMm' | 'meanSnowCoverFraction'
  | 'windDriftMm' | 'avalancheMm'
> & {
  /** Daily means, W m⁻² (see SimulationResult.bandDay). */
  absorbedShortwaveWm2: number;
  netShortwaveWm2: number;
  netLongwaveWm2: number;
  sensibleHeatWm2: number;
  latentHeatWm2: number;
};

/** The stored form of one simulation: bands, band × month rows and catchment daily volumes (m³) by source. */
export interface SimulationSummary {
  startDate: string;
  dayCount: number;
  bands: { elevationM: number; areaM2: number }[];
  months: BandMonthRow[];
  dailyM3: Record<Source, number[]>;
  /** The same sources at the outlet, routed through the catchment's stores; null without routing (the outlet is then dailyM3). */
  routedDailyM3: Record<Source, number[]> | null;
  /** How the engine started (spin-up or given state) and where its shortwave came from; null for runs stored before engine 2.0. */
  start: StartReport | null;
  shortwaveSource: ShortwaveSource | null;
}

const ENERGY_FIELDS = ['netShortwaveWm2', 'netLongwaveWm2', 'sensibleHeatWm2', 'latentHeatWm2'] as const;

const bySource = (series: Record<Source, Float64Array>) => Object.fromEntries(SOURCES.map((s) => [s, Array.from(series[s])])) as Record<Source, number[]>;

/** Reduces an engine result to what a run stores. */
export function summariseSimulation(result: SimulationResult): SimulationSummary {
  const { dayCount: nd, bandDay, startDate } = result;
  // Energy components are not in the monthly summary: sum them per band and month in one pass over the days.
  const monthOf = Array.from({ length: nd }, (_, d) => addDays(startDate, d).slice(0, 7));
  const sums = new Map<string, Record<(typeof ENERGY_FIELDS)[number], number>>();
  for (let b = 0; b < result.bandCount; b++) {
    for (let d = 0; d < nd; d++) {
      const key = `${b}:${monthOf[d]}`;
      let sum = sums.get(key);
      if (!sum) sums.set(key, (sum = { netShortwaveWm2: 0, netLongwaveWm2: 0, sensibleHeatWm2: 0, latentHeatWm2: 0 }));
      for (const field of ENERGY_FIELDS) sum[field] += bandDay[field][b * nd + d];
    }
  }
  const months = summariseByMonth(result).map((row): BandMonthRow => {
    const sum = sums.get(`${row.bandIndex}:${row.month}`)!;
    return {
      bandIndex: row.bandIndex, month: row.month, days: row.days,
      snowMeltMm: row.snowMeltMm, iceMeltMm: row.iceMeltMm, debrisIceMeltMm: row.debrisIceMeltMm,
      rainMm: row.rainMm, snowfallMm: row.snowfallMm, meanAlbedo: row.meanAlbedo,
      rainfallMm: row.rainfallMm, surfaceMeltMm: row.surfaceMeltMm, refrozenMm: row.refrozenMm,
      sublimationMm: row.sublimationMm, evaporationMm: row.evaporationMm, meanSnowCoverFraction: row.meanSnowCoverFraction,
      windDriftMm: row.windDriftMm, avalancheMm: row.avalancheMm,
      absorbedShortwaveWm2: row.meanAbsorbedShortwaveWm2,
      netShortwaveWm2: sum.netShortwaveWm2 / row.days,
      netLongwaveWm2: sum.netLongwaveWm2 / row.days,
      sensibleHeatWm2: sum.sensibleHeatWm2 / row.days,
      latentHeatWm2: sum.latentHeatWm2 / row.days,
    };
  });
  return {
    startDate,
    dayCount: nd,
    bands: Array.from(result.bands.areaM2, (areaM2, b) => ({ elevationM: result.bands.elevationM[b], areaM2 })),
    months,
    dailyM3: bySource(result.catchmentDaily.volumeM3),
    routedDailyM3: result.catchmentDaily.routed ? bySource(result.catchmentDaily.routed.volumeM3) : null,
    start: result.start,
    shortwaveSource: result.shortwaveSource,
  };
}

/** Daily total runoff volume (m³) as it leaves the bands: all melt plus rain, unrouted. */
export function dailyRunoffM3(summary: SimulationSummary): number[] {
  return totalOf(summary.dailyM3);
}

/** Daily discharge volume at the outlet (m³): routed where the run routed its runoff, else the unrouted runoff. */
export function dailyOutletM3(summary: SimulationSummary): number[] {
  return totalOf(summary.routedDailyM3 ?? summary.dailyM3);
}

function totalOf({ snow, ice, debrisIce, rain }: Record<Source, number[]>): number[] {
  return snow.map((v, d) => v + ice[d] + debrisIce[d] + rain[d]);
}

/** Daily melt volume (m³): snow, clean ice and debris-covered ice, without rain. */
export function dailyMeltM3(summary: SimulationSummary): number[] {
  const { snow, ice, debrisIce } = summary.dailyM3;
  return snow.map((v, d) => v + ice[d] + debrisIce[d]);
}
