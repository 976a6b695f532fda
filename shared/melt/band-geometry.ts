import { DEG, SEA_LEVEL_PRESSURE_PA } from './constants';
import { pressureAt } from './pressure';
import type { Band, Scenario } from './schema';
import type { Parameters } from './parameters';

/** Per-band constants of a run, one entry per band, computed once before the hour loop. */
export interface BandGeometry {
  count: number;
  /** Mean elevation (lowerM + upperM)/2, m. */
  elevationM: Float64Array;
  areaM2: Float64Array;
  /** Lapse-rate offset from the station, K. */
  temperatureOffsetC: Float64Array;
  /** Precipitation relative to the station, 1 + gradient·Δz, never below 0. */
  precipitationFactor: Float64Array;
  pressurePa: Float64Array;
  /** P/P0 for the beam path length (Hock 1999). */
  pressureRatio: Float64Array;
  cosSlope: Float64Array;
  sinSlopeCosAspect: Float64Array;
  sinSlopeSinAspect: Float64Array;
  /** (1 + cos β)/2 and (1 − cos β)/2. */
  skyView: Float64Array;
  groundView: Float64Array;
  /** Shares of the band area: clean glacier ice and debris-covered glacier ice (scenario applied). */
  cleanIceShare: Float64Array;
  debrisShare: Float64Array;
  /** Debris thickness after the scenario, m. */
  debrisThicknessM: Float64Array;
  /** k/h of the debris layer, W m⁻² K⁻¹. */
  debrisConductance: Float64Array;
}

/**
 * Debris after the scenario: the debris share of the glacier grows by debrisExtentChange of its
 * clean part; thickness changes by debrisThicknessChangeM. Bands without debris use
 * newDebrisThicknessM for newly covered ice; any thickness is raised to minDebrisThicknessM.
 */
export function buildBandGeometry(bands: Band[], stationElevationM: number, scenario: Scenario, params: Parameters): BandGeometry {
  const n = bands.length;
  const g: BandGeometry = {
    count: n,
    elevationM: new Float64Array(n), areaM2: new Float64Array(n), temperatureOffsetC: new Float64Array(n),
    precipitationFactor: new Float64Array(n), pressurePa: new Float64Array(n), pressureRatio: new Float64Array(n),
    cosSlope: new Float64Array(n), sinSlopeCosAspect: new Float64Array(n), sinSlopeSinAspect: new Float64Array(n),
    skyView: new Float64Array(n), groundView: new Float64Array(n), cleanIceShare: new Float64Array(n),
    debrisShare: new Float64Array(n), debrisThicknessM: new Float64Array(n), debrisConductance: new Float64Array(n),
  };
  bands.forEach((band, b) => {
    const z = (band.lowerM + band.upperM) / 2;
    const dzKm = (z - stationElevationM) / 1000;
    const slope = band.slopeDeg * DEG;
    const aspect = band.aspectDeg * DEG;
    const debrisOfGlacier = band.debrisFraction + (1 - band.debrisFraction) * scenario.debrisExtentChange;
    const baseThickness = band.debrisFraction > 0 && band.debrisThicknessM > 0 ? band.debrisThicknessM : params.newDebrisThicknessM;
    const thickness = Math.max(params.minDebrisThicknessM, baseThickness + scenario.debrisThicknessChangeM);
    g.elevationM[b] = z;
    g.areaM2[b] = band.areaKm2 * 1e6;
    g.temperatureOffsetC[b] = params.lapseRateCPerKm * dzKm;
    g.precipitationFactor[b] = Math.max(0, 1 + params.precipitationGradientPerKm * dzKm);
    g.pressurePa[b] = pressureAt(z);
    g.pressureRatio[b] = g.pressurePa[b] / SEA_LEVEL_PRESSURE_PA;
    g.cosSlope[b] = Math.cos(slope);
    g.sinSlopeCosAspect[b] = Math.sin(slope) * Math.cos(aspect);
    g.sinSlopeSinAspect[b] = Math.sin(slope) * Math.sin(aspect);
    g.skyView[b] = (1 + Math.cos(slope)) / 2;
    g.groundView[b] = (1 - Math.cos(slope)) / 2;
    g.cleanIceShare[b] = band.glacierFraction * (1 - debrisOfGlacier);
    g.debrisShare[b] = band.glacierFraction * debrisOfGlacier;
    g.debrisThicknessM[b] = thickness;
    g.debrisConductance[b] = params.debrisConductivity / thickness;
  });
  return g;
}
