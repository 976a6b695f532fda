import { precipitationMultiplier } from '../hydrology/precipitation-profile';
import type { GradientsReply } from '../schemas/gradients';
import { MONTH_NAMES } from '../hydrology/stations';
import { roundTo } from '../text/numbers';
import { axis, chartNumber, type ChartSpec } from './chart-spec';
import { GUIDE_GREY, INK, seriesColour } from './palette';

/** 'annual' or a month 0–11. */
export type GradientPeriod = 'annual' | number;

const GRID = { left: 84, right: 24, top: 48, bottom: 56 };

/** The bands' mid-elevations as short ticks at the left of the plot: where the gradients are applied. */
function bandTicks(bands: GradientsReply['bands'], x: number) {
  return {
    name: 'Band mid-elevations', type: 'scatter', symbol: 'rect', symbolSize: [14, 2], itemStyle: { color: GUIDE_GREY },
    data: bands.map((b) => [x, b.midM]), tooltip: { show: false },
  };
}

function elevationRange(g: GradientsReply): [number, number] {
  const z = [...g.bands.map((b) => b.midM), ...g.stations.map((s) => s.elevationM), g.referenceElevationM];
  return [Math.min(...z), Math.max(...z)];
}

const steps = (lo: number, hi: number, n = 40) => Array.from({ length: n + 1 }, (_, i) => lo + ((hi - lo) * i) / n);

/**
 * Monthly mean air temperature of each station against its elevation, with the lapse rate in force
 * for the month drawn through the reference station's temperature, and the bands' mid-elevations.
 */
export function lapseRateChart(g: GradientsReply, month: number): ChartSpec {
  const points = g.stations.flatMap((s) => (s.monthlyTemperatureC?.[month] != null ? [{ s, t: s.monthlyTemperatureC[month]! }] : []));
  const reference = points.find((p) => p.s.isReference) ?? points[0];
  const lapse = g.chosen.lapseRatesKPerKm[month];
  const [lo, hi] = elevationRange(g);
  const line = reference ? steps(lo, hi, 2).map((z) => [chartNumber(reference.t + (lapse * (z - reference.s.elevationM)) / 1000), z]) : [];
  const tMin = Math.min(...points.map((p) => p.t), ...line.map((p) => p[0] as number));
  const fit = g.lapseRates[month];
  return {
    option: {
      tooltip: { trigger: 'item' },
      legend: { top: 0 },
      grid: GRID,
      xAxis: { ...axis(`Mean air temperature in ${MONTH_NAMES[month]} (°C)`, 'value'), scale: true },
      yAxis: { ...axis('Elevation (m)', 'value'), scale: true, nameGap: 56 },
      series: [
        { name: 'Stations', type: 'scatter', symbolSize: 11, itemStyle: { color: seriesColour(0) }, data: points.map((p) => ({ value: [chartNumber(p.t), p.s.elevationM], name: p.s.name })) },
        { name: `Lapse rate in force (${roundTo(lapse, 2)} °C/km, ${g.chosen.lapseRateOrigin[month]})`, type: 'line', showSymbol: false, lineStyle: { color: INK, width: 2 }, itemStyle: { color: INK }, data: line },
        bandTicks(g.bands, Number.isFinite(tMin) ? Math.floor(tMin) - 1 : 0),
      ],
    },
    table: {
      columns: [{ name: 'station', label: 'Station' }, { name: 'elevation', label: 'Elevation (m)' }, { name: 'temperature', label: `${MONTH_NAMES[month]} mean temperature (°C)` }],
      rows: [
        ...points.map((p) => ({ station: p.s.name, elevation: p.s.elevationM, temperature: chartNumber(p.t) })),
        { station: `Fit: ${fit.status === 'fitted' ? `${roundTo(fit.lapseRateKPerKm, 2)} ± ${roundTo(fit.standardErrorKPerKm ?? 0, 2)} °C/km, r² ${roundTo(fit.r2 ?? 0, 3)}, ${fit.n} stations` : fit.note}`, elevation: null, temperature: null },
      ],
    },
  };
}

/**
 * Station precipitation (annual totals of complete years, or one month) against elevation, with
 * the profile in force scaled to the reference station's amount, and the bands' mid-elevations.
 */
export function precipitationProfileChart(g: GradientsReply, period: GradientPeriod): ChartSpec {
  const amount = (s: GradientsReply['stations'][number]) => (period === 'annual' ? s.annualPrecipitationMm : s.monthlyPrecipitationMm?.[period] ?? null);
  const points = g.stations.flatMap((s) => (amount(s) !== null ? [{ s, p: amount(s)! }] : []));
  const fit = g.precipitationFits[period === 'annual' || !g.precipitationPerMonth ? 0 : period];
  const profile = period === 'annual' ? fit.profile : g.chosen.profiles[period];
  const referenceMm = period === 'annual' || !g.precipitationPerMonth ? fit.referencePrecipitationMm : g.precipitationFits[period].referencePrecipitationMm;
  const [lo, hi] = elevationRange(g);
  const curve = referenceMm > 0 ? steps(lo, hi).map((z) => [chartNumber(referenceMm * precipitationMultiplier(profile, z, g.referenceElevationM)), roundTo(z, 0)]) : [];
  const what = period === 'annual' ? 'Annual precipitation' : `Precipitation in ${MONTH_NAMES[period]}`;
  return {
    option: {
      tooltip: { trigger: 'item' },
      legend: { top: 0 },
      grid: GRID,
      xAxis: { ...axis(`${what} (mm)`, 'value'), min: 0 },
      yAxis: { ...axis('Elevation (m)', 'value'), scale: true, nameGap: 56 },
      series: [
        { name: 'Stations', type: 'scatter', symbolSize: 11, itemStyle: { color: seriesColour(0) }, data: points.map((p) => ({ value: [chartNumber(p.p), p.s.elevationM], name: p.s.name })) },
        { name: `Profile (${fit.status === 'fitted' ? 'fitted' : 'assumed, not fitted'})`, type: 'line', showSymbol: false, lineStyle: { color: INK, width: 2 }, itemStyle: { color: INK }, data: curve },
        bandTicks(g.bands, 0),
      ],
    },
    table: {
      columns: [{ name: 'station', label: 'Station or elevation' }, { name: 'elevation', label: 'Elevation (m)' }, { name: 'mm', label: `${what} (mm)` }],
      rows: [
        ...points.map((p) => ({ station: p.s.name, elevation: p.s.elevationM, mm: chartNumber(p.p) })),
        ...curve.map(([mm, z]) => ({ station: 'Profile', elevation: z, mm })),
      ],
    },
  };
}

/** The twelve lapse rates in force, with their fitted ±1 standard error where fitted. */
export function monthlyLapseRatesChart(g: GradientsReply): ChartSpec {
  const months = MONTH_NAMES.map((m) => m.slice(0, 3));
  return {
    option: {
      tooltip: { trigger: 'axis' },
      legend: { top: 0 },
      grid: GRID,
      xAxis: axis('Month', 'category', months),
      yAxis: { ...axis('Lapse rate (°C/km)', 'value'), scale: true },
      series: [
        { name: 'In force', type: 'line', itemStyle: { color: INK }, lineStyle: { color: INK }, data: g.chosen.lapseRatesKPerKm.map((v) => chartNumber(v)) },
        { name: 'Fitted − 1 standard error', type: 'line', showSymbol: false, lineStyle: { type: 'dashed', color: seriesColour(0) }, itemStyle: { color: seriesColour(0) }, data: g.lapseRates.map((f) => (f.standardErrorKPerKm === null ? null : chartNumber(f.lapseRateKPerKm - f.standardErrorKPerKm))) },
        { name: 'Fitted + 1 standard error', type: 'line', showSymbol: false, lineStyle: { type: 'dashed', color: seriesColour(0) }, itemStyle: { color: seriesColour(0) }, data: g.lapseRates.map((f) => (f.standardErrorKPerKm === null ? null : chartNumber(f.lapseRateKPerKm + f.standardErrorKPerKm))) },
      ],
    },
    table: {
      columns: [{ name: 'month', label: 'Month' }, { name: 'force', label: 'In force (°C/km)' }, { name: 'origin', label: 'How' }, { name: 'fit', label: 'Fitted (°C/km)' }, { name: 'se', label: 'Standard error (°C/km)' }, { name: 'r2', label: 'r²' }, { name: 'n', label: 'Stations' }],
      rows: MONTH_NAMES.map((m, i) => ({
        month: m, force: chartNumber(g.chosen.lapseRatesKPerKm[i]), origin: g.chosen.lapseRateOrigin[i], fit: chartNumber(g.lapseRates[i].lapseRateKPerKm),
        se: g.lapseRates[i].standardErrorKPerKm === null ? null : chartNumber(g.lapseRates[i].standardErrorKPerKm), r2: g.lapseRates[i].r2 === null ? null : chartNumber(g.lapseRates[i].r2), n: g.lapseRates[i].n,
      })),
    },
  };
}
