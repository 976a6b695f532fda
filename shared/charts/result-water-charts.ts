import { addDays } from '../melt/calendar';
import { axis, chartNumber, GRID, LEGEND, TOOLTIP, ZOOM, type ChartSpec, type ResultItem } from './chart-spec';
import { lineStyle, seriesColour } from './palette';

/**
 * Discharge at the outlet, routed through the catchment's stores, beside the runoff as it leaves
 * the bands (unrouted): routing delays and smooths the water, it does not change how much melts.
 */
export function outletHydrograph(items: ResultItem[]): ChartSpec {
  const routed = items.filter((it) => it.results.outletDischargeM3s);
  const first = routed[0].results;
  const dates = Array.from({ length: first.dayCount }, (_, d) => addDays(first.startDate, d));
  const series: Record<string, unknown>[] = [
    { name: 'Baseline at the outlet', type: 'line', showSymbol: false, data: first.outletDischargeM3s!.baseline.map((v) => chartNumber(v)), ...lineStyle(0, true) },
  ];
  routed.forEach((it, i) => {
    series.push({ name: `${it.label} at the outlet`, type: 'line', showSymbol: false, data: it.results.outletDischargeM3s!.variant.map((v) => chartNumber(v)), ...lineStyle(i) });
    series.push({
      name: `${it.label} leaving the bands`, type: 'line', showSymbol: false, data: it.results.dischargeM3s.variant.map((v) => chartNumber(v)),
      color: seriesColour(i), lineStyle: { color: seriesColour(i), width: 1, opacity: 0.45 },
    });
  });
  return {
    option: { tooltip: TOOLTIP, legend: LEGEND, grid: GRID, dataZoom: ZOOM, xAxis: axis('Date', 'category', dates), yAxis: axis('Discharge (m³/s)', 'value'), series },
    table: {
      columns: [{ name: 'date', label: 'Date' }, { name: 'baseline', label: 'Baseline at the outlet (m³/s)' },
        ...routed.flatMap((it, i) => [{ name: `o${i}`, label: `${it.label} at the outlet (m³/s)` }, { name: `u${i}`, label: `${it.label} leaving the bands (m³/s)` }])],
      rows: dates.map((date, d) => Object.fromEntries([['date', date], ['baseline', chartNumber(first.outletDischargeM3s!.baseline[d])],
        ...routed.flatMap((it, i) => [[`o${i}`, chartNumber(it.results.outletDischargeM3s!.variant[d])], [`u${i}`, chartNumber(it.results.dischargeM3s.variant[d])]])])),
    },
  };
}

/** Snow each band gained (+) or lost (−) over the period by wind drift and by avalanching, for one run's variant. */
export function redistributionByBand(item: ResultItem): ChartSpec {
  const moved = item.results.bandRedistributionMm!.variant;
  const labels = item.results.bands.map((b) => `${Math.round(b.elevationM)} m`);
  return {
    option: {
      tooltip: { trigger: 'axis', axisPointer: { type: 'shadow' } },
      legend: { top: 0 },
      grid: { left: 80, right: 24, top: 40, bottom: 48 },
      xAxis: axis('Snow gained (+) or lost (−) over the period (mm w.e. over the band)', 'value'),
      yAxis: { type: 'category', data: labels },
      series: [
        { name: 'Wind drift', type: 'bar', stack: 'moved', itemStyle: { color: seriesColour(0) }, data: moved.map((b) => chartNumber(b.windDrift)) },
        { name: 'Avalanching', type: 'bar', stack: 'moved', itemStyle: { color: seriesColour(1) }, data: moved.map((b) => chartNumber(b.avalanche)) },
      ],
    },
    table: {
      columns: [{ name: 'band', label: 'Band (mean elevation)' }, { name: 'wind', label: 'Wind drift (mm w.e.)' }, { name: 'avalanche', label: 'Avalanching (mm w.e.)' }],
      rows: labels.map((band, i) => ({ band, wind: chartNumber(moved[i].windDrift), avalanche: chartNumber(moved[i].avalanche) })),
    },
  };
}
