/**
 * The melt engine's physics written the way a first version would be: sensible in every respect
 * but two habits — the sun position is computed for every band-hour (suncalc plus trigonometry),
 * and every step builds new objects (forcing, state and flux records). It reuses the engine's
 * validation, forcing expansion, band geometry, tables and scalar kernels, so its results match
 * the engine's; the benchmark checks that before it compares speeds.
 */
import { prepareRun } from '../../shared/melt/prepare';
import { solarPosition } from '../../shared/melt/solar-position';
import { sunGeometry } from '../../shared/melt/sun-track';
import { clearSkyBeam, extraterrestrialNormal, slopeIrradiance } from '../../shared/melt/shortwave';
import { sunAngleFactor } from '../../shared/melt/snow-albedo';
import { readTable, tablePosition, type SnowAlbedoTable } from '../../shared/melt/albedo-table';
import { readEmissivity } from '../../shared/melt/longwave';
import { debrisSurfaceTemperature } from '../../shared/melt/debris';
import { MM_PER_JOULE, spendSurplus } from '../../shared/melt/energy';
import { MELTING_SURFACE_LONGWAVE_WM2, SECONDS_PER_HOUR, STEFAN_BOLTZMANN, ZERO_CELSIUS_K } from '../../shared/melt/constants';
import type { PreparedRun } from '../../shared/melt/prepare';

interface BandState { swe: number; grain: number; coldContent: Float64Array }
interface Air { tempC: number; precipMm: number; longIn: number; sensibleCoef: number; global: number; sunFactor: number }
interface Surface { weight: number; global: number; absorbed: number; albedo: number; lwNet: number; sensible: number }
interface BandHour { state: BandState; snowMelt: number; iceMelt: number; debrisMelt: number; rain: number; snowfall: number; surfaces: Surface[] }
export interface DayTotals {
  snowMelt: number; iceMelt: number; debrisMelt: number; rain: number; snowfall: number; swe: number;
  cover: number; swIn: number; swAbs: number; lwNet: number; sensible: number; albedoSum: number;
}

function bandAir(run: PreparedRun, b: number, h: number, day: number, instantMs: number): Air {
  const { catchment } = run.input;
  const g = run.geometry;
  const f = run.forcing;
  const sun = solarPosition(new Date(instantMs), catchment.latitudeDeg, catchment.longitudeDeg);
  const [cosZ, sx, sy] = sunGeometry(sun.zenithDeg, sun.azimuthDeg);
  const tempC = f.temperatureC[h] + g.temperatureOffsetC[b];
  const tk = tempC + ZERO_CELSIUS_K;
  const beam = clearSkyBeam(extraterrestrialNormal(run.timeline.daysOfYear[day]), run.params.transmissivity, g.pressureRatio[b], cosZ);
  const global = cosZ > 0 ? slopeIrradiance({
    beamNormalWm2: beam, cosZenith: cosZ, cosIncidence: g.cosSlope[b] * cosZ + g.sinSlopeCosAspect[b] * sx + g.sinSlopeSinAspect[b] * sy,
    diffuseFraction: run.params.diffuseFraction, skyView: g.skyView[b], groundView: g.groundView[b], terrainAlbedo: run.params.terrainAlbedo, cloudFactor: f.cloudFactor[h],
  }) : 0;
  return {
    tempC,
    precipMm: f.precipitationMm[h] * g.precipitationFactor[b],
    longIn: (readEmissivity(run.emissivity, tempC) * f.clearSkyEmissivityScale[h] + f.overcastEmissivity[h]) * STEFAN_BOLTZMANN * tk * tk * tk * tk,
    sensibleCoef: (g.pressurePa[b] / tk) * f.sensibleScale[h],
    global,
    sunFactor: sunAngleFactor(cosZ),
  };
}

function stepBand(run: PreparedRun, b: number, state: BandState, air: Air, snowTable: SnowAlbedoTable, iceAlbedo: number): BandHour {
  const p = run.params;
  const g = run.geometry;
  const surfaces: Surface[] = [];
  let { swe, grain } = state;
  let snowfall = 0;
  let rain = 0;
  if (air.precipMm > 0) {
    const share = p.rainSnowTransitionK > 0 ? (p.rainSnowThresholdC + p.rainSnowTransitionK / 2 - air.tempC) / p.rainSnowTransitionK : air.tempC < p.rainSnowThresholdC ? 1 : 0;
    snowfall = air.precipMm * Math.min(1, Math.max(0, share));
    rain = air.precipMm - snowfall;
    if (snowfall > 0) {
      grain = swe > 0 ? (grain * p.snowSurfaceLayerMm + p.freshGrainRadiusUm * snowfall) / (p.snowSurfaceLayerMm + snowfall) : p.freshGrainRadiusUm;
      swe += snowfall;
    }
  }
  let snowMelt = 0;
  let exposure = 1;
  if (swe > 0) {
    const pos = tablePosition(grain);
    const clean = readTable(snowTable.clean, pos);
    const albedo = clean + 0.53 * clean * (1 - clean) * air.sunFactor + readTable(snowTable.impurity, pos);
    const absorbed = air.global * (1 - albedo);
    const lwNet = air.longIn - MELTING_SURFACE_LONGWAVE_WM2;
    const sensible = air.sensibleCoef * air.tempC;
    const melt = spendSurplus(absorbed + lwNet + sensible, state.coldContent, 0, swe, air.tempC) * MM_PER_JOULE;
    if (melt >= swe) {
      snowMelt = swe;
      exposure = (melt - swe) / melt;
      swe = 0;
    } else {
      snowMelt = melt;
      swe -= melt;
      exposure = 0;
      grain = Math.min(p.maxGrainRadiusUm, grain + ((air.tempC > 0 || melt > 0 ? p.wetGrainGrowthMm3PerDay : p.dryGrainGrowthMm3PerDay) * (1e9 / (4 * Math.PI) / 24)) / (grain * grain));
    }
    surfaces.push({ weight: 1, global: air.global, absorbed, albedo, lwNet, sensible });
  }
  let iceMelt = 0;
  let debrisMelt = 0;
  if (exposure > 0 && g.cleanIceShare[b] > 0) {
    const absorbed = air.global * (1 - iceAlbedo);
    const lwNet = air.longIn - MELTING_SURFACE_LONGWAVE_WM2;
    const sensible = air.sensibleCoef * air.tempC;
    const q = absorbed + lwNet + sensible;
    const energy = exposure < 1 ? (q > 0 ? q * SECONDS_PER_HOUR * exposure : 0) : spendSurplus(q, state.coldContent, 0, p.iceSurfaceLayerMm, air.tempC);
    iceMelt = g.cleanIceShare[b] * (energy * MM_PER_JOULE);
    if (exposure === 1) surfaces.push({ weight: g.cleanIceShare[b], global: air.global, absorbed, albedo: iceAlbedo, lwNet, sensible });
  }
  if (exposure > 0 && g.debrisShare[b] > 0) {
    const absorbed = air.global * (1 - p.debrisAlbedo);
    const k = g.debrisConductance[b];
    const ts = debrisSurfaceTemperature(absorbed, air.longIn, air.tempC, air.sensibleCoef, k, p.debrisEmissivity);
    debrisMelt = g.debrisShare[b] * (ts > 0 ? k * ts * SECONDS_PER_HOUR * MM_PER_JOULE * exposure : 0);
    const tsk = ts + ZERO_CELSIUS_K;
    if (exposure === 1) {
      surfaces.push({ weight: g.debrisShare[b], global: air.global, absorbed, albedo: p.debrisAlbedo,
        lwNet: air.longIn - p.debrisEmissivity * STEFAN_BOLTZMANN * tsk * tsk * tsk * tsk, sensible: air.sensibleCoef * (air.tempC - ts) });
    }
  }
  return { state: { ...state, swe, grain }, snowMelt, iceMelt, debrisMelt, rain, snowfall, surfaces };
}

function addStep(t: DayTotals, step: BandHour): DayTotals {
  const next: DayTotals = {
    ...t,
    snowMelt: t.snowMelt + step.snowMelt, iceMelt: t.iceMelt + step.iceMelt, debrisMelt: t.debrisMelt + step.debrisMelt,
    rain: t.rain + step.rain, snowfall: t.snowfall + step.snowfall, swe: step.state.swe,
  };
  for (const s of step.surfaces) {
    next.cover += s.weight;
    next.swIn += s.weight * s.global;
    next.swAbs += s.weight * s.absorbed;
    next.lwNet += s.weight * s.lwNet;
    next.sensible += s.weight * s.sensible;
    next.albedoSum += s.weight * s.albedo * s.global;
  }
  return next;
}

/** Runs the naive engine and returns per band per day totals (day-major list of band records). */
export function simulateNaive(input: unknown): DayTotals[][] {
  const run = prepareRun(input);
  const { timeline } = run;
  let states: BandState[] = Array.from(run.initialSweMm, (swe) => ({ swe, grain: run.params.freshGrainRadiusUm, coldContent: new Float64Array(1) }));
  const days: DayTotals[][] = [];
  for (let d = 0; d < timeline.dayCount; d++) {
    const month = timeline.months[d];
    let totals: DayTotals[] = states.map(() => ({ snowMelt: 0, iceMelt: 0, debrisMelt: 0, rain: 0, snowfall: 0, swe: 0, cover: 0, swIn: 0, swAbs: 0, lwNet: 0, sensible: 0, albedoSum: 0 }));
    for (let k = 0; k < 24; k++) {
      const h = d * 24 + k;
      const instantMs = timeline.dayStartUtcMs[d] + (k + 0.5) * 3_600_000;
      const steps = states.map((state, b) => stepBand(run, b, state, bandAir(run, b, h, d, instantMs), run.tables.snow[month], run.tables.iceAlbedo[month]));
      states = steps.map((s) => s.state);
      totals = totals.map((t, b) => addStep(t, steps[b]));
    }
    days.push(totals);
  }
  return days;
}
