import { ACC, type LoopContext } from './loop-context';
import { bandDay } from './band-day';
import { packWaterMm } from './state';
import { redistributeDay } from './redistribution';
import type { SimulationResult } from './result';

export interface Progress {
  /** Days simulated so far and in total (spin-up included). */
  day: number;
  dayCount: number;
  fraction: number;
}
export type ProgressCallback = (progress: Progress) => void;

/**
 * The simulation loop: every segment (spin-up, then the period), every day, every band, every
 * hour. Everything is allocated before the loop (loop-context.ts); inside it nothing is, and
 * work shared by all bands for an hour (sun, sky, cloud) was done once, by hour, before it.
 * Bands exchange neither mass nor energy, so each band runs through a day's 24 hours in turn,
 * and per band-hour the only transcendental calls are the clear-sky beam's exponential and, in
 * daylight over snow, the snow-albedo cloud term; albedo, emissivity and vapour pressure come
 * from tables. Only days of recorded segments are written to the result. Bands exchange snow
 * only once a day, after every band has run through it (redistribution.ts); with routing on, the
 * day's runoff by source is kept for every simulated day, spin-up included, for routing after the loop.
 *
 * @returns the pack water per band at the start of the period (for the result's totals)
 */
export function runSegments(c: LoopContext, result: SimulationResult, onProgress?: ProgressCallback): Float64Array {
  const run = c.run;
  const nb = run.geometry.count;
  const total = run.segments.reduce((n, s) => n + s.lastDay - s.firstDay + 1, 0);
  const sweStart = new Float64Array(nb);
  const r = c.redistribution;
  const volumes = c.stepVolumesM3;
  const area = run.geometry.areaM2;
  const a = c.acc;
  let done = 0;
  for (const segment of run.segments) {
    if (segment.record) for (let b = 0; b < nb; b++) sweStart[b] = packWaterMm(run.state, b);
    for (let d = segment.firstDay; d <= segment.lastDay; d++) {
      const month = run.timeline.months[d];
      const recordDay = segment.record ? d - run.recordFirstDay : -1;
      for (let b = 0; b < nb; b++) {
        a.fill(0);
        bandDay(c, b, d, month);
        if (recordDay >= 0) writeBandDay(c, result, b, recordDay);
        if (r) r.snowfallMm[b] = a[ACC.snowfall];
        if (volumes) {
          const m3PerMm = area[b] / 1000;
          volumes.snow[done] += a[ACC.snowRunoff] * m3PerMm;
          volumes.ice[done] += a[ACC.iceMelt] * m3PerMm;
          volumes.debrisIce[done] += a[ACC.debrisMelt] * m3PerMm;
          volumes.rain[done] += a[ACC.rainRunoff] * m3PerMm;
        }
      }
      if (r) {
        redistributeDay(r, run.state);
        if (recordDay >= 0) writeRedistribution(c, result, recordDay);
      }
      done++;
      if (onProgress && (done === total || run.timeline.months[d + 1] !== month)) onProgress({ day: done, dayCount: total, fraction: done / total });
    }
  }
  return sweStart;
}

/** The day's snow gained or lost per band, and the SWE after the move. */
function writeRedistribution(c: LoopContext, result: SimulationResult, d: number): void {
  const r = c.redistribution!;
  const out = result.bandDay;
  for (let b = 0; b < result.bandCount; b++) {
    const i = b * result.dayCount + d;
    out.windDriftMm[i] = r.wind ? r.windNetMm[b] : 0;
    out.avalancheMm[i] = r.avalanche ? r.avalancheNetMm[b] : 0;
    out.sweMm[i] = packWaterMm(c.run.state, b);
  }
}

function writeBandDay(c: LoopContext, result: SimulationResult, b: number, d: number): void {
  const a = c.acc;
  const s = c.run.state;
  const out = result.bandDay;
  const i = b * result.dayCount + d;
  const weight = a[ACC.weight];
  out.snowMeltMm[i] = a[ACC.snowRunoff];
  out.iceMeltMm[i] = a[ACC.iceMelt];
  out.debrisIceMeltMm[i] = a[ACC.debrisMelt];
  out.rainMm[i] = a[ACC.rainRunoff];
  out.snowfallMm[i] = a[ACC.snowfall];
  out.rainfallMm[i] = a[ACC.rainfall];
  out.liquidWaterMm[i] = s.liquidMeltMm[b] + s.liquidRainMm[b];
  out.sweMm[i] = packWaterMm(s, b);
  out.surfaceMeltMm[i] = a[ACC.surfaceMelt];
  out.refrozenMm[i] = a[ACC.refrozen];
  out.sublimationMm[i] = a[ACC.sublimation];
  out.evaporationMm[i] = a[ACC.evaporation];
  out.iceVapourLossMm[i] = a[ACC.iceVapour];
  out.snowCoverFraction[i] = a[ACC.snowCover] / 24;
  out.incomingShortwaveWm2[i] = weight > 0 ? a[ACC.shortwaveIn] / weight : 0;
  out.netShortwaveWm2[i] = weight > 0 ? a[ACC.shortwaveAbsorbed] / weight : 0;
  out.absorbedShortwaveWm2[i] = a[ACC.shortwaveAbsorbed] / 24;
  out.netLongwaveWm2[i] = weight > 0 ? a[ACC.longwaveNet] / weight : 0;
  out.sensibleHeatWm2[i] = weight > 0 ? a[ACC.sensible] / weight : 0;
  out.latentHeatWm2[i] = weight > 0 ? a[ACC.latent] / weight : 0;
  out.albedo[i] = a[ACC.shortwaveIn] > 0 ? a[ACC.albedoWeighted] / a[ACC.shortwaveIn] : 0;
  out.debrisSurfaceMaxC[i] = a[ACC.debrisSeen] > 0 ? a[ACC.debrisMax] : 0;
  out.airTemperatureC[i] = a[ACC.airTemperature] / 24;
}
