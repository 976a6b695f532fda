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
  const differences = (a: Record<(typeof keys)[number], Float64Array>, b: Record<(typeof keys)[number], Float64Array>) =>
    Object.fromEntries(keys.map((k) => [k, difference(a[k], b[k])])) as SimulationResult['catchmentDaily']['volumeM3'];
  const routedA = baseline.catchmentDaily.routed;
  const routedB = variant.catchmentDaily.routed;
  return {
    ...variant,
    bandDay: Object.fromEntries(BAND_DAY_FIELDS.map((k) => [k, difference(baseline.bandDay[k], variant.bandDay[k])])) as SimulationResult['bandDay'],
    catchmentDaily: {
      volumeM3: differences(baseline.catchmentDaily.volumeM3, variant.catchmentDaily.volumeM3),
      dischargeM3s: differences(baseline.catchmentDaily.dischargeM3s, variant.catchmentDaily.dischargeM3s),
      routed: routedA && routedB ? { volumeM3: differences(routedA.volumeM3, routedB.volumeM3), dischargeM3s: differences(routedA.dischargeM3s, routedB.dischargeM3s) } : null,
    },
    bandTotals: Object.fromEntries(BAND_TOTAL_FIELDS.map((k) => [k, difference(baseline.bandTotals[k], variant.bandTotals[k])])) as SimulationResult['bandTotals'],
  };
}
