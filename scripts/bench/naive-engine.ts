/**
 * The melt engine's physics written the way a first version would be: sensible in every respect
 * but two habits — the sun position is computed for every band-hour (suncalc plus trigonometry),
 * and every step builds new objects (air, sky and surface records, result arrays for the kernels).
 * It reuses the engine's validation, forcing expansion, band geometry, tables and the physics
 * kernels (snow, ice and debris steps, impurities, snow cover), and keeps its own state as one
 * object per band, so it checks the engine's loop — hoisting, per-hour sharing, bookkeeping — as
 * a differential test (naive-engine.test.ts) and is the yardstick of the benchmark.
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
import { addSnowfall, coverOf, snowHour } from '../../shared/melt/band-day';
import { glacierHour } from '../../shared/melt/glacier-hour';
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

function hour(c: LoopContext, b: number, h: number, month: number, instantMs: number): void {
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
  if (fall.snow > 0) addSnowfall(c, b, fall.snow, airC, month);
  const cover = coverOf(c, b);
  c.acc[ACC.snowCover] += cover;
  c.acc[ACC.airTemperature] += airC;
  const glacier = g.cleanIceShare[b] > 0 || g.debrisShare[b] > 0;
  if (cover <= 0 && !glacier) {
    c.acc[ACC.rainRunoff] += fall.rain;
    return;
  }
  const now = sky(run, c.shortwave, b, h, instantMs, airC, c.clearSkyEmissivityScale[h], c.overcastEmissivity[h]);
  const tk = airC + ZERO_CELSIUS_K;
  Object.assign(c.air, {
    airC, vapourPa: f.relativeHumidity[h] * readTable(run.airVapour, airC), windMs: f.windMs[h],
    sensibleCoefficient: g.pressurePa[b] * c.cpOverRd * p.exchangeCoefficient * (1 / tk) * f.windMs[h],
    vapourCoefficient: c.vapourOverRd * p.exchangeCoefficient * (1 / tk) * f.windMs[h],
  });
  if (cover > 0) snowHour(c, b, h, month, cover, now.global, now.longIn, fall.rain, airC);
  else c.acc[ACC.rainRunoff] += fall.rain;
  if (glacier) glacierHour(c, b, month, 1 - cover, now.global, now.longIn, airC, tk);
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
        for (let k = 0; k < 24; k++) hour(context, b, d * 24 + k, run.timeline.months[d], run.timeline.dayStartUtcMs[d] + (k + 0.5) * 3_600_000);
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
