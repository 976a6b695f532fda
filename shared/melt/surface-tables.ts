import { buildSnowAlbedoTable, type SnowAlbedoTable } from './albedo-table';
import { iceAlbedo } from './ice-albedo';
import { monthValue } from './hourly-forcing';
import type { Scenario } from './schema';
import type { Parameters } from './parameters';

/** Albedo inputs for each calendar month (impurity loads may change month by month). */
export interface SurfaceTables {
  snow: SnowAlbedoTable[];
  iceAlbedo: Float64Array;
}

export function buildSurfaceTables(scenario: Scenario, params: Parameters): SurfaceTables {
  const snow: SnowAlbedoTable[] = [];
  const ice = new Float64Array(12);
  const cache = new Map<number, SnowAlbedoTable>();
  for (let m = 0; m < 12; m++) {
    const bcEq = monthValue(scenario.blackCarbonSnowNgG, m) + monthValue(scenario.dustSnowUgG, m) * 1000 * params.dustToBlackCarbon;
    let table = cache.get(bcEq);
    if (!table) {
      table = buildSnowAlbedoTable(params.maxGrainRadiusUm, bcEq);
      cache.set(bcEq, table);
    }
    snow.push(table);
    ice[m] = iceAlbedo(params.iceAlbedo, monthValue(scenario.blackCarbonIceNgG, m), monthValue(scenario.dustIceUgG, m), {
      blackCarbonSlope: params.iceAlbedoBlackCarbonSlope,
      dustSlope: params.iceAlbedoDustSlope,
      floor: params.iceAlbedoFloor,
    });
  }
  return { snow, iceAlbedo: ice };
}
