import type { WaterBalanceClosure } from '../schemas/water-balance';
import { BALANCE_TERM_LABELS } from '../text/water-side';
import { axis, chartNumber, type ChartSpec } from './chart-spec';
import { INK, lineStyle, REFERENCE_GREY, seriesColour } from './palette';

const TERMS = ['precipitationMm', 'evaporationSublimationMm', 'snowStorageChangeMm', 'iceStorageChangeMm', 'storesChangeMm', 'modelledRunoffMm', 'measuredRunoffMm'] as const;

/** The balance terms with the station precipitation and with the inferred one, side by side (mm over the catchment). */
export function balanceTermsChart(c: WaterBalanceClosure): ChartSpec {
  const labels = TERMS.map((t) => BALANCE_TERM_LABELS[t]);
  return {
    option: {
      tooltip: { trigger: 'axis', axisPointer: { type: 'shadow' } },
      legend: { top: 0 },
      grid: { left: 230, right: 24, top: 40, bottom: 48 },
      xAxis: axis('mm over the catchment', 'value'),
      yAxis: { type: 'category', data: labels, inverse: true },
      series: [
        { name: 'With station precipitation', type: 'bar', itemStyle: { color: REFERENCE_GREY }, data: TERMS.map((t) => chartNumber(c.stationBalance[t])) },
        { name: 'With inferred precipitation', type: 'bar', itemStyle: { color: seriesColour(0) }, data: TERMS.map((t) => chartNumber(c.balance[t])) },
      ],
    },
    table: {
      columns: [{ name: 'term', label: 'Balance term' }, { name: 'station', label: 'With station precipitation (mm)' }, { name: 'inferred', label: 'With inferred precipitation (mm)' }],
      rows: [...TERMS, 'closureMm' as const].map((t) => ({ term: BALANCE_TERM_LABELS[t], station: chartNumber(c.stationBalance[t]), inferred: chartNumber(c.balance[t]) })),
    },
  };
}

/** Precipitation per band over the period: the station record shaped by the stations' profile, against the inferred one. */
export function precipitationByElevationChart(c: WaterBalanceClosure): ChartSpec {
  return {
    option: {
      tooltip: { trigger: 'axis', axisPointer: { type: 'line', axis: 'y' } },
      legend: { top: 0 },
      grid: { left: 84, right: 24, top: 40, bottom: 56 },
      xAxis: { ...axis('Precipitation over the period (mm)', 'value'), min: 0 },
      yAxis: { ...axis('Band mid-elevation (m)', 'value'), scale: true, nameGap: 56 },
      series: [
        { name: 'Measured at the stations, extrapolated', type: 'line', data: c.bands.map((b) => [chartNumber(b.stationPrecipitationMm), b.midM]), ...lineStyle(0, true) },
        { name: 'Inferred from the water balance', type: 'line', data: c.bands.map((b) => [chartNumber(b.inferredPrecipitationMm), b.midM]), ...lineStyle(0), lineStyle: { color: seriesColour(0), width: 2.5 }, itemStyle: { color: seriesColour(0) } },
      ],
    },
    table: {
      columns: [{ name: 'z', label: 'Band mid-elevation (m)' }, { name: 'area', label: 'Area (km²)' }, { name: 'station', label: 'Station, extrapolated (mm)' }, { name: 'inferred', label: 'Inferred (mm)' }, { name: 'ratio', label: 'Inferred over station' }],
      rows: c.bands.map((b) => ({
        z: b.midM, area: b.areaKm2, station: chartNumber(b.stationPrecipitationMm), inferred: chartNumber(b.inferredPrecipitationMm),
        ratio: b.stationPrecipitationMm > 0 ? chartNumber(b.inferredPrecipitationMm / b.stationPrecipitationMm) : null,
      })),
    },
  };
}

/** How far each observation lies from the model at the solution, in standard uncertainties (|σ| ≤ 2 closes). */
export function misfitChart(c: WaterBalanceClosure): ChartSpec {
  return {
    option: {
      tooltip: { trigger: 'axis', axisPointer: { type: 'shadow' } },
      grid: { left: 200, right: 24, top: 24, bottom: 48 },
      xAxis: { ...axis('Modelled − measured (standard uncertainties)', 'value'), min: -3, max: 3 },
      yAxis: { type: 'category', data: c.misfits.map((m) => m.label), inverse: true },
      series: [{
        name: 'Misfit', type: 'bar', itemStyle: { color: seriesColour(1) }, data: c.misfits.map((m) => chartNumber(m.sigmas)),
        markLine: { silent: true, symbol: 'none', lineStyle: { color: INK, type: 'dashed' }, data: [{ xAxis: -2 }, { xAxis: 2 }] },
      }],
    },
    table: { columns: [{ name: 'label', label: 'Observation' }, { name: 'sigmas', label: 'Misfit (σ)' }], rows: c.misfits.map((m) => ({ label: m.label, sigmas: chartNumber(m.sigmas) })) },
  };
}
