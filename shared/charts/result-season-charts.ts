import { addDays } from '../melt/calendar';
import { lineStyle } from './palette';
import { axis, chartNumber, GRID, LEGEND, ZOOM, type ChartSpec, type ResultItem } from './chart-spec';
import { TOOLTIP } from './chart-style';

const datesOf = (item: ResultItem) => Array.from({ length: item.results.dayCount }, (_, d) => addDays(item.results.startDate, d));

/** Baseline and variant discharge through the season; the added part shaded; ensemble 5–95 % bands. */
export function hydrograph(items: ResultItem[]): ChartSpec {
  const dates = datesOf(items[0]);
  const baseline = items[0].results.dischargeM3s.baseline;
  const series: Record<string, unknown>[] = [{ name: 'Baseline', type: 'line', showSymbol: false, data: baseline.map((v) => chartNumber(v)), ...lineStyle(0, true) }];
  items.forEach((item, i) => {
    const { variant, baseline: paired } = item.results.dischargeM3s;
    const style = lineStyle(i);
    series.push({ name: item.label, type: 'line', showSymbol: false, data: variant.map((v) => chartNumber(v)), ...style });
    // The added part: the paired baseline (invisible) with the difference stacked on it and shaded.
    const stack = `added-${i}`;
    series.push({ name: `${item.label}: added`, type: 'line', stack, stackStrategy: 'all', showSymbol: false, silent: true, lineStyle: { opacity: 0 }, data: paired.map((v) => chartNumber(v)), tooltip: { show: false } });
    series.push({ name: `${item.label}: added`, type: 'line', stack, stackStrategy: 'all', showSymbol: false, lineStyle: { opacity: 0 }, areaStyle: { color: style.color, opacity: 0.25 }, data: variant.map((v, d) => chartNumber(v - paired[d])) });
    const ensemble = item.results.ensemble;
    if (ensemble) {
      const band = `ensemble-${i}`;
      const { p5, p95 } = ensemble.dischargeM3s;
      series.push({ name: `${item.label}: 5–95 %`, type: 'line', stack: band, showSymbol: false, silent: true, lineStyle: { opacity: 0 }, data: p5.map((v) => chartNumber(v)), tooltip: { show: false } });
      series.push({ name: `${item.label}: 5–95 %`, type: 'line', stack: band, showSymbol: false, lineStyle: { opacity: 0 }, areaStyle: { color: style.color, opacity: 0.12, decal: { symbol: 'line' } }, data: p95.map((v, d) => chartNumber(v - p5[d])) });
    }
  });
  return {
    option: { tooltip: TOOLTIP, legend: LEGEND, grid: GRID, dataZoom: ZOOM, xAxis: axis('Date', 'category', dates), yAxis: axis('Discharge (m³/s)', 'value'), series },
    table: {
      columns: [{ name: 'date', label: 'Date' }, { name: 'baseline', label: 'Baseline (m³/s)' },
        ...items.flatMap((it, i) => [{ name: `v${i}`, label: `${it.label} (m³/s)` }, ...(it.results.ensemble ? [{ name: `lo${i}`, label: `${it.label} 5 % (m³/s)` }, { name: `hi${i}`, label: `${it.label} 95 % (m³/s)` }] : [])])],
      rows: dates.map((date, d) => Object.fromEntries([['date', date], ['baseline', chartNumber(baseline[d])],
        ...items.flatMap((it, i) => [[`v${i}`, chartNumber(it.results.dischargeM3s.variant[d])],
          ...(it.results.ensemble ? [[`lo${i}`, chartNumber(it.results.ensemble.dischargeM3s.p5[d])], [`hi${i}`, chartNumber(it.results.ensemble.dischargeM3s.p95[d])]] : [])])])),
    },
  };
}

/** Cumulative added runoff volume through the season, per variant. */
export function cumulativeAdded(items: ResultItem[]): ChartSpec {
  const dates = datesOf(items[0]);
  return {
    option: {
      tooltip: TOOLTIP, legend: LEGEND, grid: GRID, dataZoom: ZOOM, xAxis: axis('Date', 'category', dates), yAxis: axis('Cumulative added volume (m³)', 'value'),
      series: items.map((it, i) => ({ name: it.label, type: 'line', showSymbol: false, data: it.results.cumulativeAddedM3.map((v) => chartNumber(v)), ...lineStyle(i) })),
    },
    table: {
      columns: [{ name: 'date', label: 'Date' }, ...items.map((it, i) => ({ name: `v${i}`, label: `${it.label} (m³)` }))],
      rows: dates.map((date, d) => Object.fromEntries([['date', date], ...items.map((it, i) => [`v${i}`, chartNumber(it.results.cumulativeAddedM3[d])])])),
    },
  };
}

/** Monthly mean albedo of one band: baseline against each variant. */
export function albedoOfBand(items: ResultItem[], band: number): ChartSpec {
  const months = items[0].results.months;
  const baseline = items[0].results.albedo.baseline[band];
  return {
    option: {
      tooltip: TOOLTIP, legend: LEGEND, grid: GRID, xAxis: axis('Month', 'category', months), yAxis: { ...axis('Albedo', 'value'), min: 0, max: 1 },
      series: [{ name: 'Baseline', type: 'line', data: baseline.map((v) => chartNumber(v)), ...lineStyle(0, true) },
        ...items.map((it, i) => ({ name: it.label, type: 'line', data: it.results.albedo.variant[band].map((v) => chartNumber(v)), ...lineStyle(i) }))],
    },
    table: {
      columns: [{ name: 'month', label: 'Month' }, { name: 'baseline', label: 'Baseline albedo' }, ...items.map((it, i) => ({ name: `v${i}`, label: `${it.label} albedo` }))],
      rows: months.map((month, m) => Object.fromEntries([['month', month], ['baseline', chartNumber(baseline[m])], ...items.map((it, i) => [`v${i}`, chartNumber(it.results.albedo.variant[band][m])])])),
    },
  };
}
