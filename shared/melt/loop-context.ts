import { GAS_CONSTANT_DRY_AIR, SPECIFIC_HEAT_AIR, VAPOUR_MASS_RATIO } from './constants';
import { OVERCAST_EMISSIVITY } from './longwave';
import { neutralExchange, roughnessForExchange } from './turbulence';
import { snowLayers, type SnowLayers } from './snow-pack';
import { DEBRIS_IN_SIZE, type DebrisColumn } from './debris-layers';
import { cloudTermTable, type CloudTermTable } from './albedo-table';
import { IMPURITY_IN_SIZE } from './impurities';
import type { PreparedRun } from './prepare';
import type { ShortwaveForcing } from './shortwave-forcing';
import type { SunTrack } from './sun-track';
import { STEP_IN_SIZE, type TurbulentAir } from './surface-flux';
import { SOURCES, type MeltModel, type Source } from './result';
import { planRedistribution, type Redistribution } from './redistribution';

/** Slots of the per band-day accumulators the hour step adds to. */
export const ACC = {
  snowRunoff: 0, iceMelt: 1, debrisMelt: 2, rainRunoff: 3, snowfall: 4, rainfall: 5, surfaceMelt: 6, refrozen: 7,
  sublimation: 8, evaporation: 9, iceVapour: 10, weight: 11, shortwaveIn: 12, shortwaveAbsorbed: 13, longwaveNet: 14,
  sensible: 15, latent: 16, albedoWeighted: 17, snowCover: 18, debrisMax: 19, debrisSeen: 20, airTemperature: 21,
} as const;
export const ACC_SIZE = 22;

/**
 * The weather of the band being simulated through one day, hour by hour (band-day.ts: worked out
 * by bandWeather, used by bandSurfaces and glacierHour). The air's own arrays (temperature,
 * longwave, vapour pressure, turbulent coefficients) hold two days' length: hours 24–47 are the
 * air over the band's snow-free glacier where the band climate damps it (katabatic cooling,
 * BandGeometry.glacierTemperatureDeltaK ≠ 0), filled only then (AIR_OVER_GLACIER).
 */
export interface BandHours {
  airC: Float64Array;
  airK: Float64Array;
  rainMm: Float64Array;
  snowMm: Float64Array;
  /** Shortwave on the band's slope and incoming longwave, W m⁻². */
  globalWm2: Float64Array;
  longInWm2: Float64Array;
  /** Vapour pressure of the air, Pa, wind, and the neutral turbulent coefficients of TurbulentAir. */
  vapourPa: Float64Array;
  windMs: Float64Array;
  sensibleCoefficient: Float64Array;
  vapourCoefficient: Float64Array;
  /** Snow-covered share of the band in each hour, for the glacier the snow leaves exposed. */
  cover: Float64Array;
}

/** Offset of the damped air over snow-free glacier in BandHours' air arrays. */
export const AIR_OVER_GLACIER = 24;

function allocateBandHours(): BandHours {
  const day = () => new Float64Array(24);
  const air = () => new Float64Array(24 + AIR_OVER_GLACIER);
  return {
    airC: air(), airK: air(), rainMm: day(), snowMm: day(), globalWm2: day(), longInWm2: air(),
    vapourPa: air(), windMs: day(), sensibleCoefficient: air(), vapourCoefficient: air(), cover: day(),
  };
}

/** Everything the hour step reads, gathered once per run so the loop allocates nothing. */
export interface LoopContext {
  run: PreparedRun;
  sun: SunTrack;
  shortwave: ShortwaveForcing;
  model: 0 | 1 | 2;
  stability: boolean;
  /** RH^(1/7)(1 − n⁴) and 0.952 n⁴ per hour: they turn the tabulated saturated clear-sky emissivity into the all-sky value. */
  clearSkyEmissivityScale: Float64Array;
  overcastEmissivity: Float64Array;
  layers: SnowLayers;
  /** Neutral exchange of snow and ice (from the exchange coefficient) and of debris (from its roughness). */
  snowIceDrag: number;
  snowIceHeightOverRoughness: number;
  debrisExchange: number;
  debrisDrag: number;
  debrisHeightOverRoughness: number;
  /** cp/Rd and 0.622/Rd: with P/T and CH u they give the sensible and vapour coefficients. */
  cpOverRd: number;
  vapourOverRd: number;
  air: TurbulentAir;
  hours: BandHours;
  /** Grain growth per hour, µm³-equivalent: dr = rate / r² (dV/(4πr²), Brun 1989 form). */
  wetGrowth: number;
  dryGrowth: number;
  columns: DebrisColumn[];
  cloudTerm: CloudTermTable;
  acc: Float64Array;
  scratch: Float64Array;
  /** What the snow, ice, debris and impurity steps read (STEP_IN.*, DEBRIS_IN.*, IMPURITY_IN.*); the ice's rain heat stays 0. */
  snowInput: Float64Array;
  iceInput: Float64Array;
  debrisInput: Float64Array;
  impurityInput: Float64Array;
  /** Snow moved between bands at the end of each day; null when the run does not redistribute. */
  redistribution: Redistribution | null;
  /** With routing on: the catchment's runoff volume by source for every simulated day in order (spin-up first), m³. */
  stepVolumesM3: Record<Source, Float64Array> | null;
}

/** µm of radius growth per hour, times r², from a grain volume growth in mm³ per day: dr = dV/(4πr²). */
const GRAIN_SCALE = 1e9 / (4 * Math.PI) / 24;

const MODEL_CODE: Record<MeltModel, 0 | 1 | 2> = { 'energy-balance': 0, 'degree-day': 1, 'enhanced-temperature-index': 2 };

export function buildLoopContext(run: PreparedRun, sun: SunTrack, shortwave: ShortwaveForcing, model: MeltModel): LoopContext {
  const p = run.params;
  const hours = run.timeline.dayCount * 24;
  const clear = new Float64Array(hours);
  const overcast = new Float64Array(hours);
  // RH^(1/7) again only when the humidity changes (daily series repeat it through the day).
  let humidity = NaN;
  let humidityRoot = 0;
  for (let h = 0; h < hours; h++) {
    const n = shortwave.cloudiness[h];
    const n4 = n * n * n * n;
    if (run.forcing.relativeHumidity[h] !== humidity) {
      humidity = run.forcing.relativeHumidity[h];
      humidityRoot = Math.pow(humidity, 1 / 7);
    }
    clear[h] = humidityRoot * (1 - n4);
    overcast[h] = OVERCAST_EMISSIVITY * n4;
  }
  const snowIce = neutralExchange(roughnessForExchange(p.exchangeCoefficient));
  const debris = neutralExchange(p.debrisRoughnessM);
  const g = run.geometry;
  return {
    run, sun, shortwave, model: MODEL_CODE[model], stability: run.input.physics.stabilityCorrection,
    clearSkyEmissivityScale: clear, overcastEmissivity: overcast,
    layers: snowLayers(p.snowDensityKgM3, p.liquidWaterHoldingFraction),
    snowIceDrag: snowIce.drag, snowIceHeightOverRoughness: snowIce.heightOverRoughness,
    debrisExchange: debris.heat, debrisDrag: debris.drag, debrisHeightOverRoughness: debris.heightOverRoughness,
    cpOverRd: SPECIFIC_HEAT_AIR / GAS_CONSTANT_DRY_AIR, vapourOverRd: VAPOUR_MASS_RATIO / GAS_CONSTANT_DRY_AIR,
    air: { airC: 0, vapourPa: 0, windMs: 1, sensibleCoefficient: 0, vapourCoefficient: 0 },
    hours: allocateBandHours(),
    wetGrowth: p.wetGrainGrowthMm3PerDay * GRAIN_SCALE,
    dryGrowth: p.dryGrainGrowthMm3PerDay * GRAIN_SCALE,
    columns: Array.from({ length: g.count }, (_, b) => ({
      thicknessM: g.debrisColumnM[b], conductivity: p.debrisConductivity, heatCapacity: p.debrisHeatCapacityMJm3K * 1e6,
      emissivity: p.debrisEmissivity, sensibleCoefficient: 0, drag: debris.drag, heightOverRoughness: debris.heightOverRoughness,
    })),
    cloudTerm: cloudTermTable(),
    acc: new Float64Array(ACC_SIZE),
    scratch: new Float64Array(16),
    snowInput: new Float64Array(STEP_IN_SIZE),
    iceInput: new Float64Array(STEP_IN_SIZE),
    debrisInput: new Float64Array(DEBRIS_IN_SIZE),
    impurityInput: new Float64Array(IMPURITY_IN_SIZE),
    redistribution: planRedistribution(run.input, run.input.catchment.bands),
    stepVolumesM3: run.input.routing ? stepVolumes(run) : null,
  };
}

function stepVolumes(run: PreparedRun): Record<Source, Float64Array> {
  const steps = run.segments.reduce((n, s) => n + s.lastDay - s.firstDay + 1, 0);
  return Object.fromEntries(SOURCES.map((source) => [source, new Float64Array(steps)])) as Record<Source, Float64Array>;
}
