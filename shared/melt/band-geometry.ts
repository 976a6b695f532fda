import { DEG } from './constants';
import { precipitableWaterFactor } from './clear-sky';
import { pressureAt } from './pressure';
import type { Band, ParsedInput, Scenario } from './schema';
import type { Parameters } from './parameters';

/** Per-band constants of a run, one entry per band, computed once before the hour loop. */
export interface BandGeometry {
  count: number;
  /** Mean elevation (lowerM + upperM)/2, m. */
  elevationM: Float64Array;
  areaM2: Float64Array;
  /**
   * Per band and month (band-major, b·12 + m): air temperature at the band minus the station's, K
   * (the lapse rate × Δz, or the band climate of fitted gradients), and precipitation relative to
   * the station (1 + gradient·Δz, never below 0, or the band climate's multiplier).
   */
  temperatureOffsetK: Float64Array;
  precipitationMultiplier: Float64Array;
  /** Over the snow-free glacier: how much cooler (negative) the katabatic layer keeps the air than the free air, K; b·12 + m. */
  glacierTemperatureDeltaK: Float64Array;
  /** 1 where any month has a glacier temperature delta (so the hour loop computes a second air state). */
  hasGlacierDelta: Uint8Array;
  pressurePa: Float64Array;
  /** Pressure in kPa, for the clear-sky beam exponent (ASCE-EWRI 2005). */
  pressureKPa: Float64Array;
  /** (W(z)/W(station))^0.4, the band's precipitable-water factor in the beam exponent. */
  vapourFactor: Float64Array;
  cosSlope: Float64Array;
  sinSlopeCosAspect: Float64Array;
  sinSlopeSinAspect: Float64Array;
  /** Sky-view factor (given, or (1 + cos β)/2) and its complement, the terrain the band sees. */
  skyView: Float64Array;
  groundView: Float64Array;
  /** Terrain horizons: 1 where the band has one; values band-major, sector-major, 5 percentiles each. */
  hasHorizon: Uint8Array;
  horizonDeg: Float64Array;
  horizonSectors: number;
  /** Shares of the band area: clean glacier ice and debris-covered glacier ice (scenario applied). */
  cleanIceShare: Float64Array;
  debrisShare: Float64Array;
  /** Mean debris thickness after the scenario, m (0: the debris is gone). */
  debrisThicknessM: Float64Array;
  /** Thickness of the debris patches, max(mean, patchy threshold), and the share of the debris area they cover. */
  debrisColumnM: Float64Array;
  debrisPatchShare: Float64Array;
}

/**
 * Debris after the scenario: the debris share of the glacier grows by debrisExtentChange of its
 * clean part; thickness changes by debrisThicknessChangeM (not below 0). Bands without debris use
 * newDebrisThicknessM for newly covered ice. Debris thinner on average than patchyDebrisThicknessM
 * lies in patches of that thickness covering mean/threshold of the debris area, with bare ice
 * between them: the rising limb of the Østrem curve (see parameters.ts for the sources).
 */
export function buildBandGeometry(bands: Band[], stationElevationM: number, scenario: Scenario, params: Parameters, climate?: ParsedInput['bandClimate']): BandGeometry {
  const n = bands.length;
  const f64 = () => new Float64Array(n);
  const monthly = () => new Float64Array(n * 12);
  const sectors = bands.find((b) => b.horizonDeg)?.horizonDeg?.length ?? 0;
  const g: BandGeometry = {
    count: n, elevationM: f64(), areaM2: f64(), pressurePa: f64(),
    temperatureOffsetK: monthly(), precipitationMultiplier: monthly(), glacierTemperatureDeltaK: monthly(), hasGlacierDelta: new Uint8Array(n),
    pressureKPa: f64(), vapourFactor: f64(), cosSlope: f64(), sinSlopeCosAspect: f64(), sinSlopeSinAspect: f64(),
    skyView: f64(), groundView: f64(), hasHorizon: new Uint8Array(n), horizonDeg: new Float64Array(n * sectors * 5), horizonSectors: sectors,
    cleanIceShare: f64(), debrisShare: f64(), debrisThicknessM: f64(), debrisColumnM: f64(), debrisPatchShare: f64(),
  };
  bands.forEach((band, b) => {
    const z = (band.lowerM + band.upperM) / 2;
    const dzKm = (z - stationElevationM) / 1000;
    const slope = band.slopeDeg * DEG;
    const aspect = band.aspectDeg * DEG;
    const debrisOfGlacier = band.debrisFraction + (1 - band.debrisFraction) * scenario.debrisExtentChange;
    const baseThickness = band.debrisFraction > 0 && band.debrisThicknessM > 0 ? band.debrisThicknessM : params.newDebrisThicknessM;
    const thickness = Math.max(0, baseThickness + scenario.debrisThicknessChangeM);
    g.elevationM[b] = z;
    g.areaM2[b] = band.areaKm2 * 1e6;
    for (let m = 0; m < 12; m++) {
      const i = b * 12 + m;
      g.temperatureOffsetK[i] = climate ? climate.temperatureOffsetK[i] : params.lapseRateCPerKm * dzKm;
      g.precipitationMultiplier[i] = climate ? climate.precipitationMultiplier[i] : Math.max(0, 1 + params.precipitationGradientPerKm * dzKm);
      g.glacierTemperatureDeltaK[i] = climate ? climate.glacierTemperatureOffsetK[i] - climate.temperatureOffsetK[i] : 0;
      if (g.glacierTemperatureDeltaK[i] !== 0) g.hasGlacierDelta[b] = 1;
    }
    g.pressurePa[b] = pressureAt(z);
    g.pressureKPa[b] = g.pressurePa[b] / 1000;
    g.vapourFactor[b] = precipitableWaterFactor(z, stationElevationM);
    g.cosSlope[b] = Math.cos(slope);
    g.sinSlopeCosAspect[b] = Math.sin(slope) * Math.cos(aspect);
    g.sinSlopeSinAspect[b] = Math.sin(slope) * Math.sin(aspect);
    g.skyView[b] = band.skyViewFactor ?? (1 + Math.cos(slope)) / 2;
    g.groundView[b] = 1 - g.skyView[b];
    if (band.horizonDeg) {
      g.hasHorizon[b] = 1;
      band.horizonDeg.forEach((q, k) => q.forEach((v, i) => (g.horizonDeg[(b * sectors + k) * 5 + i] = v)));
    }
    g.cleanIceShare[b] = band.glacierFraction * (1 - debrisOfGlacier);
    g.debrisShare[b] = band.glacierFraction * debrisOfGlacier;
    g.debrisThicknessM[b] = thickness;
    g.debrisColumnM[b] = Math.max(thickness, params.patchyDebrisThicknessM);
    g.debrisPatchShare[b] = Math.min(1, thickness / params.patchyDebrisThicknessM);
  });
  return g;
}
