import { iceAlbedo } from './ice-albedo';
import { monthValue } from './hourly-forcing';
import type { BandImpurities, Scenario } from './schema';
import type { Parameters } from './parameters';

/**
 * Month-by-month inputs of the surfaces of each band (loads may change month by month and differ
 * between bands), band-major: band b, month m (January = 0) at b·12 + m.
 */
export interface SurfaceTables {
  /** Bare-ice albedo with the scenario's added loads (user-set rule, ice-albedo.ts). */
  iceAlbedo: Float64Array;
  /** Black carbon (ng g⁻¹) and dust (µg g⁻¹) in fresh snowfall: background plus scenario. */
  freshBlackCarbonNgG: Float64Array;
  freshDustUgG: Float64Array;
  /** Dry deposition onto snow per hour: black carbon ng m⁻², dust µg m⁻². */
  blackCarbonDepositionNgM2Hour: Float64Array;
  dustDepositionUgM2Hour: Float64Array;
}

/**
 * The tables for every band: the scenario's loads, replaced field by field where the band has
 * loads of its own (`impuritiesByBand`, e.g. a dirtier tongue than the accumulation area).
 */
export function buildSurfaceTables(
  scenario: Scenario, params: Parameters, background: { blackCarbonSnowNgG: number; dustSnowUgG: number },
  bandCount: number, impuritiesByBand?: readonly (BandImpurities | null)[],
): SurfaceTables {
  const size = bandCount * 12;
  const t: SurfaceTables = {
    iceAlbedo: new Float64Array(size), freshBlackCarbonNgG: new Float64Array(size), freshDustUgG: new Float64Array(size),
    blackCarbonDepositionNgM2Hour: new Float64Array(size), dustDepositionUgM2Hour: new Float64Array(size),
  };
  for (let b = 0; b < bandCount; b++) {
    const own = impuritiesByBand?.[b];
    const loads = own ? { ...scenario, ...own } : scenario;
    for (let m = 0; m < 12; m++) {
      const i = b * 12 + m;
      t.iceAlbedo[i] = iceAlbedo(params.iceAlbedo, monthValue(loads.blackCarbonIceNgG, m), monthValue(loads.dustIceUgG, m), {
        blackCarbonSlope: params.iceAlbedoBlackCarbonSlope,
        dustSlope: params.iceAlbedoDustSlope,
        floor: params.iceAlbedoFloor,
      });
      t.freshBlackCarbonNgG[i] = background.blackCarbonSnowNgG + monthValue(loads.blackCarbonSnowNgG, m);
      t.freshDustUgG[i] = background.dustSnowUgG + monthValue(loads.dustSnowUgG, m);
      t.blackCarbonDepositionNgM2Hour[i] = (monthValue(scenario.blackCarbonDepositionUgM2Day, m) * 1000) / 24;
      t.dustDepositionUgM2Hour[i] = (monthValue(scenario.dustDepositionMgM2Day, m) * 1000) / 24;
    }
  }
  return t;
}
