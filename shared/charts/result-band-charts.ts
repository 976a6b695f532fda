import { SOURCES } from '../melt/result';
import { INK, SURFACE_STYLES, lineStyle, seriesColour } from './palette';
import { axis, chartNumber, GRID, LEGEND, type ChartSpec, type ResultItem } from './chart-spec';
import { BAR_TOOLTIP } from './chart-style';

const bandLabel = (elevationM: number) => `${Math.round(elevationM)} m`;

/** Added melt per elevation band, stacked by surface, one stack per variant. */
export function addedMeltByBand(items: ResultItem[]): ChartSpec {
  const bands = items[0].results.bands.map((b) => bandLabel(b.elevationM));
  const series = items.flatMap((it, i) => SOURCES.map((source) => ({
    name: items.length > 1 ? `${it.label}: ${SURFACE_STYLES[source].label}` : SURFACE_STYLES[source].label,
    type: 'bar', stack: `v${i}`, data: it.results.bandAddedMm.map((b) => chartNumber(b[source])),
    itemStyle: { color: SURFACE_STYLES[source].colour, borderColor: '#333', borderWidth: 0.5, opacity: 1 - i * 0.12 },
  })));
  return {
    option: { tooltip: BAR_TOOLTIP, legend: LEGEND, grid: GRID, xAxis: axis('Band mean elevation (m)', 'category', bands), yAxis: axis('Added melt (mm w.e. over the band)', 'value'), series },
    table: {
      columns: [{ name: 'band', label: 'Band mean elevation (m)' }, ...items.flatMap((it, i) => SOURCES.map((s) => ({ name: `${i}-${s}`, label: `${it.label}: ${SURFACE_STYLES[s].label} (mm w.e.)` })))],
      rows: bands.map((band, b) => Object.fromEntries([['band', band], ...items.flatMap((it, i) => SOURCES.map((s) => [`${i}-${s}`, chartNumber(it.results.bandAddedMm[b][s])]))])),
    },
  };
}

const ENERGY = [
  { key: 'netShortwave', label: 'Net shortwave' },
  { key: 'netLongwave', label: 'Net longwave' },
  { key: 'sensibleHeat', label: 'Sensible heat' },
] as const;

/** Catchment-mean energy components per month of one variant against its baseline. */
export function energyComponents(item: ResultItem): ChartSpec {
  const { months, energy } = item.results;
  const series = ENERGY.flatMap(({ key, label }, k) => [
    { name: `${label}, baseline`, type: 'bar', data: energy.baseline[key].map((v) => chartNumber(v)), itemStyle: { color: lineStyle(k).color, opacity: 0.45, decal: { symbol: 'line' } } },
    { name: `${label}, ${item.label}`, type: 'bar', data: energy.variant[key].map((v) => chartNumber(v)), itemStyle: { color: lineStyle(k).color } },
  ]);
  return {
    option: { tooltip: BAR_TOOLTIP, legend: LEGEND, grid: GRID, xAxis: axis('Month', 'category', months), yAxis: axis('Energy flux, catchment mean (W/m²)', 'value'), series },
    table: {
      columns: [{ name: 'month', label: 'Month' }, ...ENERGY.flatMap(({ key, label }) => [{ name: `b-${key}`, label: `${label}, baseline (W/m²)` }, { name: `v-${key}`, label: `${label}, ${item.label} (W/m²)` }])],
      rows: months.map((month, m) => Object.fromEntries([['month', month], ...ENERGY.flatMap(({ key }) => [[`b-${key}`, chartNumber(energy.baseline[key][m])], [`v-${key}`, chartNumber(energy.variant[key][m])]])])),
    },
  };
}

/** Shift of the date by which half the season's melt has run off, per variant. */
export function timingShift(items: ResultItem[]): ChartSpec {
  const labels = items.map((it) => it.label);
  return {
    option: {
      tooltip: BAR_TOOLTIP, grid: { ...GRID, bottom: 90 }, xAxis: { ...axis('Variant', 'category', labels), nameGap: 60, axisLine: { onZero: false }, axisLabel: { interval: 0, width: 140, overflow: 'break' } }, yAxis: axis('Timing shift of half melt (days; − = earlier)', 'value'),
      series: [{ name: 'Timing shift', type: 'bar', barMaxWidth: 60, data: items.map((it, i) => ({ value: it.results.totals.timingShiftDays, itemStyle: { color: seriesColour(i), decal: { symbol: 'line' } } })) }],
    },
    table: {
      columns: [{ name: 'variant', label: 'Variant' }, { name: 'baseline', label: 'Baseline half-melt date' }, { name: 'variantDate', label: 'Variant half-melt date' }, { name: 'shift', label: 'Shift (days)' }],
      rows: items.map((it) => ({ variant: it.label, baseline: it.results.totals.baselineHalfMeltDate, variantDate: it.results.totals.variantHalfMeltDate, shift: it.results.totals.timingShiftDays })),
    },
  };
}

/** Factor separation as a waterfall: each driver and interaction adds its part, ending at the full change. */
export function attributionWaterfall(item: ResultItem): ChartSpec {
  const terms = item.results.attribution?.terms ?? [];
  const labels = [...terms.map((t) => t.label), 'Full change'];
  const values = terms.map((t) => t.addedVolumeM3 / 1e6);
  let running = 0;
  const base: number[] = [];
  const shown: number[] = [];
  for (const v of values) {
    base.push(v >= 0 ? running : running + v);
    shown.push(Math.abs(v));
    running += v;
  }
  base.push(Math.min(0, running));
  shown.push(Math.abs(running));
  return {
    option: {
      tooltip: BAR_TOOLTIP, grid: { ...GRID, bottom: 110 },
      xAxis: { ...axis('Driver or interaction', 'category', labels), nameGap: 90, axisLabel: { rotate: 30, interval: 0 } }, yAxis: axis('Added volume (million m³)', 'value'),
      series: [
        { name: 'offset', type: 'bar', stack: 'w', silent: true, itemStyle: { color: 'transparent' }, data: base.map((v) => chartNumber(v)), tooltip: { show: false } },
        { name: 'Contribution', type: 'bar', stack: 'w', data: shown.map((v, i) => ({ value: chartNumber(v), itemStyle: { color: i === shown.length - 1 ? INK : (values[i] ?? 0) >= 0 ? seriesColour(0) : seriesColour(1), decal: i === shown.length - 1 ? { symbol: 'rect' } : undefined } })) },
      ],
    },
    table: {
      columns: [{ name: 'term', label: 'Driver or interaction' }, { name: 'volume', label: 'Added volume (million m³)' }, { name: 'depth', label: 'Added depth (mm w.e.)' }],
      rows: [...terms.map((t) => ({ term: t.label, volume: chartNumber(t.addedVolumeM3 / 1e6), depth: chartNumber(t.addedDepthMm) })),
        { term: 'Full change', volume: chartNumber((item.results.attribution?.fullChangeM3 ?? 0) / 1e6), depth: chartNumber(item.results.totals.addedDepthMm) }],
    },
  };
}
