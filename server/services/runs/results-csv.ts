import type { RunResults } from '../../../shared/schemas/results';
import type { SimulationSummary } from '../../../shared/analysis/simulation-summary';
import { addDays } from '../../../shared/melt/calendar';
import { csvLine } from '../../../shared/csv/csv-writing';
import { roundSignificant } from '../../../shared/text/numbers';
import { setUpLines } from '../../../shared/analysis/run-set-up';
import type { TransientResults } from '../../../shared/schemas/transient-results';

/** Numbers to 8 significant digits: enough for the model, readable in a spreadsheet. */
const line = (values: (string | number | null)[]) => csvLine(values.map((v) => (typeof v === 'number' && !Number.isInteger(v) ? roundSignificant(v, 8) : v)));

/** The header block every export starts with: what was run, on what, with which engine, and the cautions. */
export function headerBlock(results: Pick<RunResults, 'run' | 'catchmentName' | 'setUp' | 'cautions'>, what: string, period: string): string[] {
  const { run } = results;
  return [
    line(['# Tarnish export', what]),
    line(['# Catchment', results.catchmentName]),
    line(['# Scenario', run.scenarioName]),
    line(['# Period', period]),
    line(['# Engine version', run.engineVersion]),
    line(['# Input hash', run.inputHash]),
    line(['# Run', run.id]),
    ...setUpLines(results.setUp).map(([label, text]) => line([`# ${label}`, text])),
    ...results.cautions.map((c) => line(['# Caution', c])),
  ];
}

/** Per band × month rows of the baseline and the scenario, with the added melt by source. */
export function bandMonthCsv(results: RunResults, baseline: SimulationSummary, variant: SimulationSummary): string {
  const key = (r: { bandIndex: number; month: string }) => `${r.bandIndex}|${r.month}`;
  const base = new Map(baseline.months.map((r) => [key(r), r]));
  const rows = variant.months.map((v) => {
    const b = base.get(key(v))!;
    const band = results.bands[v.bandIndex];
    return line([
      v.bandIndex + 1, Math.round(band.elevationM), band.areaM2 / 1e6, v.month,
      v.snowMeltMm - b.snowMeltMm, v.iceMeltMm - b.iceMeltMm, v.debrisIceMeltMm - b.debrisIceMeltMm, v.rainMm - b.rainMm,
      v.snowMeltMm, v.iceMeltMm, v.debrisIceMeltMm, v.rainMm, b.meanAlbedo, v.meanAlbedo,
      b.absorbedShortwaveWm2, v.absorbedShortwaveWm2,
      v.surfaceMeltMm, v.refrozenMm, v.sublimationMm, v.evaporationMm, b.meanSnowCoverFraction, v.meanSnowCoverFraction,
      v.windDriftMm, v.avalancheMm,
    ]);
  });
  return [
    ...headerBlock(results, 'per elevation band and month', seasonPeriod(results)),
    line(['band', 'mean elevation (m)', 'area (km²)', 'month', 'added snow melt (mm w.e.)', 'added clean-ice melt (mm w.e.)',
      'added debris-covered ice melt (mm w.e.)', 'added rain (mm)', 'scenario snow melt (mm w.e.)', 'scenario clean-ice melt (mm w.e.)',
      'scenario debris-covered ice melt (mm w.e.)', 'scenario rain (mm)', 'baseline albedo (-)', 'scenario albedo (-)',
      'baseline absorbed shortwave (W/m²)', 'scenario absorbed shortwave (W/m²)',
      'scenario surface melt (mm w.e.)', 'scenario refrozen (mm w.e.)', 'scenario sublimation (mm w.e.)', 'scenario evaporation (mm w.e.)',
      'baseline snow-covered fraction (-)', 'scenario snow-covered fraction (-)',
      'scenario snow gained (+) or lost (−) by wind drift (mm w.e.)', 'scenario snow gained (+) or lost (−) by avalanching (mm w.e.)']),
    ...rows,
  ].join('\r\n') + '\r\n';
}

/** Daily catchment series: discharge of baseline and scenario (as it leaves the bands, and routed to the outlet where the run routed), added discharge and cumulative added volume. */
export function dailyCsv(results: RunResults): string {
  const { baseline, variant } = results.dischargeM3s;
  const band = results.ensemble?.dischargeM3s;
  const outlet = results.outletDischargeM3s;
  const rows = variant.map((v, d) => line([
    addDays(results.startDate, d), baseline[d], v, v - baseline[d], results.cumulativeAddedM3[d],
    ...(outlet ? [outlet.baseline[d], outlet.variant[d]] : []),
    ...(band ? [band.p5[d], band.p50[d], band.p95[d]] : []),
  ]));
  return [
    ...headerBlock(results, 'daily catchment series', seasonPeriod(results)),
    line(['date', 'baseline discharge (m³/s)', 'scenario discharge (m³/s)', 'added discharge (m³/s)', 'cumulative added volume (m³)',
      ...(outlet ? ['baseline discharge routed to the outlet (m³/s)', 'scenario discharge routed to the outlet (m³/s)'] : []),
      ...(band ? ['ensemble 5 % discharge (m³/s)', 'ensemble median discharge (m³/s)', 'ensemble 95 % discharge (m³/s)'] : [])]),
    ...rows,
  ].join('\r\n') + '\r\n';
}

const seasonPeriod = (results: RunResults) => `${results.startDate} + ${results.dayCount} days`;

/** A multi-decade run year by year: the warming, the glacier and the runoff by source of baseline and scenario. */
export function yearsCsv(results: TransientResults): string {
  const { baseline: b, variant: v } = results;
  const rows = results.years.map((year, i) => line([
    year, results.recordYears[i], results.globalWarmingC[i], results.temperatureDeltaC[i], results.precipitationFactor[i],
    b.glacierAreaKm2[i], v.glacierAreaKm2[i], b.glacierVolumeKm3[i], v.glacierVolumeKm3[i], b.massBalanceMm[i], v.massBalanceMm[i],
    b.runoffM3.snow[i], b.runoffM3.ice[i], b.runoffM3.debrisIce[i], b.runoffM3.rain[i],
    v.runoffM3.snow[i], v.runoffM3.ice[i], v.runoffM3.debrisIce[i], v.runoffM3.rain[i],
    b.glacierRunoffM3[i], v.glacierRunoffM3[i], b.smoothedGlacierRunoffM3[i], v.smoothedGlacierRunoffM3[i],
  ]));
  return [
    ...headerBlock(results, 'multi-decade run, year by year', `${results.years[0]} to ${results.years.at(-1)}`),
    line(['# Peak water (baseline)', b.peakWater.text]),
    line(['# Peak water (scenario)', v.peakWater.text]),
    ...results.findings.map((f) => line(['# Finding', f])),
    line(['year', 'record year used', 'global warming above 1850–1900 (°C)', 'temperature change applied (°C)', 'precipitation factor applied (-)',
      'baseline glacier area (km²)', 'scenario glacier area (km²)', 'baseline glacier volume (km³)', 'scenario glacier volume (km³)',
      'baseline glacier-wide balance (mm w.e.)', 'scenario glacier-wide balance (mm w.e.)',
      'baseline snow melt runoff (m³)', 'baseline clean-ice melt runoff (m³)', 'baseline debris-covered ice melt runoff (m³)', 'baseline rain runoff (m³)',
      'scenario snow melt runoff (m³)', 'scenario clean-ice melt runoff (m³)', 'scenario debris-covered ice melt runoff (m³)', 'scenario rain runoff (m³)',
      'baseline glacier runoff (m³)', 'scenario glacier runoff (m³)', 'baseline glacier runoff, 11-year mean (m³)', 'scenario glacier runoff, 11-year mean (m³)']),
    ...rows,
  ].join('\r\n') + '\r\n';
}
