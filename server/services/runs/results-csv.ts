import type { RunResults } from '../../../shared/schemas/results';
import type { SimulationSummary } from '../../../shared/analysis/simulation-summary';
import { addDays } from '../../../shared/melt/calendar';
import { csvLine } from '../../../shared/csv/csv-writing';
import { roundSignificant } from '../../../shared/text/numbers';
import { setUpLines } from '../../../shared/analysis/run-set-up';

/** Numbers to 8 significant digits: enough for the model, readable in a spreadsheet. */
const line = (values: (string | number | null)[]) => csvLine(values.map((v) => (typeof v === 'number' && !Number.isInteger(v) ? roundSignificant(v, 8) : v)));

/** The header block every export starts with: what was run, on what, with which engine, and the cautions. */
export function headerBlock(results: RunResults, what: string): string[] {
  const { run } = results;
  return [
    line(['# Tarnish export', what]),
    line(['# Catchment', results.catchmentName]),
    line(['# Scenario', run.scenarioName]),
    line(['# Period', `${results.startDate} + ${results.dayCount} days`]),
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
    ]);
  });
  return [
    ...headerBlock(results, 'per elevation band and month'),
    line(['band', 'mean elevation (m)', 'area (km²)', 'month', 'added snow melt (mm w.e.)', 'added clean-ice melt (mm w.e.)',
      'added debris-covered ice melt (mm w.e.)', 'added rain (mm)', 'scenario snow melt (mm w.e.)', 'scenario clean-ice melt (mm w.e.)',
      'scenario debris-covered ice melt (mm w.e.)', 'scenario rain (mm)', 'baseline albedo', 'scenario albedo',
      'baseline absorbed shortwave (W/m²)', 'scenario absorbed shortwave (W/m²)',
      'scenario surface melt (mm w.e.)', 'scenario refrozen (mm w.e.)', 'scenario sublimation (mm w.e.)', 'scenario evaporation (mm w.e.)',
      'baseline snow-covered fraction (0–1)', 'scenario snow-covered fraction (0–1)']),
    ...rows,
  ].join('\r\n') + '\r\n';
}

/** Daily catchment series: discharge of baseline and scenario, added discharge and cumulative added volume. */
export function dailyCsv(results: RunResults): string {
  const { baseline, variant } = results.dischargeM3s;
  const band = results.ensemble?.dischargeM3s;
  const rows = variant.map((v, d) => line([
    addDays(results.startDate, d), baseline[d], v, v - baseline[d], results.cumulativeAddedM3[d],
    ...(band ? [band.p5[d], band.p50[d], band.p95[d]] : []),
  ]));
  return [
    ...headerBlock(results, 'daily catchment series'),
    line(['date', 'baseline discharge (m³/s)', 'scenario discharge (m³/s)', 'added discharge (m³/s)', 'cumulative added volume (m³)',
      ...(band ? ['ensemble 5 % discharge (m³/s)', 'ensemble median discharge (m³/s)', 'ensemble 95 % discharge (m³/s)'] : [])]),
    ...rows,
  ].join('\r\n') + '\r\n';
}
