import { iceAlbedo } from './ice-albedo';
import { monthValue } from './hourly-forcing';
import type { Scenario } from './schema';
import type { Parameters } from './parameters';

/** Month-by-month inputs of the surfaces (loads may change month by month), January first. */
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

export function buildSurfaceTables(scenario: Scenario, params: Parameters, background: { blackCarbonSnowNgG: number; dustSnowUgG: number }): SurfaceTables {
  const t: SurfaceTables = {
    iceAlbedo: new Float64Array(12), freshBlackCarbonNgG: new Float64Array(12), freshDustUgG: new Float64Array(12),
    blackCarbonDepositionNgM2Hour: new Float64Array(12), dustDepositionUgM2Hour: new Float64Array(12),
  };
  for (let m = 0; m < 12; m++) {
    t.iceAlbedo[m] = iceAlbedo(params.iceAlbedo, monthValue(scenario.blackCarbonIceNgG, m), monthValue(scenario.dustIceUgG, m), {
      blackCarbonSlope: params.iceAlbedoBlackCarbonSlope,
      dustSlope: params.iceAlbedoDustSlope,
      floor: params.iceAlbedoFloor,
    });
    t.freshBlackCarbonNgG[m] = background.blackCarbonSnowNgG + monthValue(scenario.blackCarbonSnowNgG, m);
    t.freshDustUgG[m] = background.dustSnowUgG + monthValue(scenario.dustSnowUgG, m);
    t.blackCarbonDepositionNgM2Hour[m] = (monthValue(scenario.blackCarbonDepositionUgM2Day, m) * 1000) / 24;
    t.dustDepositionUgM2Hour[m] = (monthValue(scenario.dustDepositionMgM2Day, m) * 1000) / 24;
  }
  return t;
}
