import { BAND_DAY_FIELDS, BAND_TOTAL_FIELDS, SOURCES, type SimulationResult } from './result';

function difference(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = b[i] - a[i];
  return out;
}

/**
 * Variant minus baseline for every per band per day array, catchment daily series and band
 * totals. Both runs must cover the same days and bands; band information is the variant's.
 * (Differences of albedo and fluxes are differences of the daily means.)
 */
export function compareRuns(baseline: SimulationResult, variant: SimulationResult): SimulationResult {
  if (baseline.startDate !== variant.startDate || baseline.dayCount !== variant.dayCount || baseline.bandCount !== variant.bandCount) {
    throw new RangeError(
      `compareRuns: runs differ in shape (baseline ${baseline.startDate} × ${baseline.dayCount} days × ${baseline.bandCount} bands, ` +
      `variant ${variant.startDate} × ${variant.dayCount} days × ${variant.bandCount} bands)`,
    );
  }
  const keys = [...SOURCES, 'total'] as const;
  return {
    ...variant,
    bandDay: Object.fromEntries(BAND_DAY_FIELDS.map((k) => [k, difference(baseline.bandDay[k], variant.bandDay[k])])) as SimulationResult['bandDay'],
    catchmentDaily: {
      volumeM3: Object.fromEntries(keys.map((k) => [k, difference(baseline.catchmentDaily.volumeM3[k], variant.catchmentDaily.volumeM3[k])])) as SimulationResult['catchmentDaily']['volumeM3'],
      dischargeM3s: Object.fromEntries(keys.map((k) => [k, difference(baseline.catchmentDaily.dischargeM3s[k], variant.catchmentDaily.dischargeM3s[k])])) as SimulationResult['catchmentDaily']['dischargeM3s'],
    },
    bandTotals: Object.fromEntries(BAND_TOTAL_FIELDS.map((k) => [k, difference(baseline.bandTotals[k], variant.bandTotals[k])])) as SimulationResult['bandTotals'],
  };
}
