/**
 * The melt engine's physics written the way a first version would be: sensible in every respect
 * but two habits — the sun position is computed for every band-hour (suncalc plus trigonometry),
 * and every step builds new objects (sun, precipitation, sky and air records, the day's
 * accumulators and totals). It works out each band-hour's weather itself, the naive way, and hands
 * it to the engine's surface physics (bandSurfaces: snow, ice, debris, impurities, snow cover),
 * reusing the engine's validation, forcing expansion, band geometry and tables; so it checks the
 * engine's weather pass — the sun once per hour for all bands, band constants hoisted, nothing
 * allocated — as a differential test (naive-engine.test.ts) and is the yardstick of the benchmark.
 */
import { prepareRun, type PreparedRun } from '../../shared/melt/prepare';
import { solarPosition } from '../../shared/melt/solar-position';
import { buildSunTrack, sunGeometry } from '../../shared/melt/sun-track';
import { buildShortwaveForcing, type ShortwaveForcing } from '../../shared/melt/shortwave-forcing';
import { erbsDiffuseFraction } from '../../shared/melt/diffuse-split';
import { diffuseIndex } from '../../shared/melt/clear-sky';
import { horizonSector, sunlitShare } from '../../shared/melt/terrain';
import { readTable } from '../../shared/melt/temperature-table';
import { ACC, buildLoopContext, type LoopContext } from '../../shared/melt/loop-context';
import { bandSurfaces } from '../../shared/melt/band-day';
import { ZERO_CELSIUS_K, STEFAN_BOLTZMANN } from '../../shared/melt/constants';

export interface DayTotals {
  snowRunoff: number; iceMelt: number; debrisMelt: number; rainRunoff: number; swe: number; cover: number; shortwaveAbsorbedWm2: number;
}

interface Sky { global: number; longIn: number }

function sky(run: PreparedRun, sw: ShortwaveForcing, b: number, h: number, instantMs: number, airC: number, clearScale: number, overcast: number): Sky {
  const { catchment } = run.input;
  const g = run.geometry;
  const sun = solarPosition(new Date(instantMs), catchment.latitudeDeg, catchment.longitudeDeg);
  const [cosZ, sx, sy] = sunGeometry(sun.zenithDeg, sun.azimuthDeg);
  let global = 0;
  if (cosZ > 0) {
    const kb = 0.98 * Math.exp(sw.pressureTerm[h] * g.pressureKPa[b] + sw.vapourTerm[h] * g.vapourFactor[b]);
    const clearness = sw.cloudIndex[h] * (kb + diffuseIndex(kb));
    const horizontal = clearness * sw.topHorizontalWm2[h];
    const diffuse = horizontal * erbsDiffuseFraction(clearness);
    const cosI = g.cosSlope[b] * cosZ + g.sinSlopeCosAspect[b] * sx + g.sinSlopeSinAspect[b] * sy;
    let direct = cosI > 0 ? (horizontal - diffuse) * (1 / cosZ) * cosI : 0;
    if (direct > 0 && g.hasHorizon[b]) direct *= sunlitShare(g.horizonDeg, (b * g.horizonSectors + horizonSector(sun.azimuthDeg, g.horizonSectors)) * 5, 90 - sun.zenithDeg);
    global = direct + diffuse * g.skyView[b] + run.params.terrainAlbedo * horizontal * g.groundView[b];
  }
  const tk = airC + ZERO_CELSIUS_K;
  const emissivity = readTable(run.emissivity, airC) * clearScale + overcast;
  return { global, longIn: (emissivity * g.skyView[b] + g.groundView[b]) * STEFAN_BOLTZMANN * (tk * tk) * (tk * tk) };
}

/** The weather of band b in hour h (hour k of its day, in `month`), written where the engine's surface pass reads it; no glacier damping. */
function weather(c: LoopContext, b: number, h: number, k: number, month: number, instantMs: number): void {
  const run = c.run;
  const g = run.geometry;
  const p = run.params;
  const f = run.forcing;
  const airC = f.temperatureC[h] + g.temperatureOffsetK[b * 12 + month];
  const precipitation = f.precipitationMm[h] * g.precipitationMultiplier[b * 12 + month];
  const width = p.rainSnowTransitionK;
  const top = p.rainSnowThresholdC + width / 2;
  const snowShare = width > 0 ? Math.min(1, Math.max(0, (top - airC) * (1 / width))) : airC < top ? 1 : 0;
  const snow = precipitation * snowShare;
  const fall = { snow, rain: precipitation - snow };
  c.acc[ACC.snowfall] += fall.snow;
  c.acc[ACC.rainfall] += fall.rain;
  c.acc[ACC.airTemperature] += airC;
  const now = sky(run, c.shortwave, b, h, instantMs, airC, c.clearSkyEmissivityScale[h], c.overcastEmissivity[h]);
  const tk = airC + ZERO_CELSIUS_K;
  const air = {
    airC, vapourPa: f.relativeHumidity[h] * readTable(run.airVapour, airC), windMs: f.windMs[h],
    sensibleCoefficient: g.pressurePa[b] * c.cpOverRd * p.exchangeCoefficient * (1 / tk) * f.windMs[h],
    vapourCoefficient: c.vapourOverRd * p.exchangeCoefficient * (1 / tk) * f.windMs[h],
  };
  const w = c.hours;
  w.airC[k] = air.airC;
  w.airK[k] = tk;
  w.rainMm[k] = fall.rain;
  w.snowMm[k] = fall.snow;
  w.globalWm2[k] = now.global;
  w.longInWm2[k] = now.longIn;
  w.vapourPa[k] = air.vapourPa;
  w.windMs[k] = air.windMs;
  w.sensibleCoefficient[k] = air.sensibleCoefficient;
  w.vapourCoefficient[k] = air.vapourCoefficient;
}

/** Runs the input the naive way; returns the recorded days' totals, day by day, band by band. */
export function simulateNaive(input: unknown): DayTotals[][] {
  const run = prepareRun(input);
  const sun = buildSunTrack(run.timeline, run.input.catchment.latitudeDeg, run.input.catchment.longitudeDeg);
  const context = buildLoopContext(run, sun, buildShortwaveForcing(run.timeline, sun, run.forcing, run.params, run.stationPressurePa, run.input.shortwaveSource), 'energy-balance');
  const days: DayTotals[][] = [];
  for (const segment of run.segments) {
    for (let d = segment.firstDay; d <= segment.lastDay; d++) {
      const bands: DayTotals[] = [];
      for (let b = 0; b < run.geometry.count; b++) {
        context.acc = new Float64Array(context.acc.length);
        const month = run.timeline.months[d];
        for (let k = 0; k < 24; k++) weather(context, b, d * 24 + k, k, month, run.timeline.dayStartUtcMs[d] + (k + 0.5) * 3_600_000);
        bandSurfaces(context, b, d, month);
        const a = context.acc;
        const s = run.state;
        bands.push({
          snowRunoff: a[ACC.snowRunoff], iceMelt: a[ACC.iceMelt], debrisMelt: a[ACC.debrisMelt], rainRunoff: a[ACC.rainRunoff],
          swe: s.sweMm[b] + s.liquidMeltMm[b] + s.liquidRainMm[b], cover: a[ACC.snowCover] / 24, shortwaveAbsorbedWm2: a[ACC.shortwaveAbsorbed] / 24,
        });
      }
      if (segment.record) days.push(bands);
    }
  }
  return days;
}
