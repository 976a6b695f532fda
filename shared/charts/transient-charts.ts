import type { TransientResults, TransientSeries } from '../schemas/transient-results';
import { SURFACE_STYLES, lineStyle, seriesColour, INK } from './palette';
import { axis, chartNumber, GRID, LEGEND, TOOLTIP, type ChartSpec } from './chart-spec';

const years = (r: TransientResults) => r.years.map(String);
const million = (m3: number | null) => (m3 === null ? null : chartNumber(m3 / 1e6));
const pair = (r: TransientResults, variant: string) => [{ name: 'Baseline', s: r.baseline, style: lineStyle(0, true) }, { name: variant, s: r.variant, style: lineStyle(0) }];

/** Glacier area and ice volume at the start of each year, baseline against the variant. */
export function glacierChart(r: TransientResults, variant: string): ChartSpec {
  const series = pair(r, variant).flatMap(({ name, s, style }) => [
    { name: `${name}: area`, type: 'line', showSymbol: false, data: s.glacierAreaKm2.map((v) => chartNumber(v)), ...style },
    { name: `${name}: volume`, type: 'line', yAxisIndex: 1, showSymbol: false, data: s.glacierVolumeKm3.map((v) => chartNumber(v)), ...style, lineStyle: { ...style.lineStyle, width: 1.5, type: 'dotted' } },
  ]);
  return {
    option: {
      tooltip: TOOLTIP, legend: LEGEND, grid: { ...GRID, right: 72 }, xAxis: axis('Year', 'category', years(r)),
      yAxis: [{ ...axis('Glacier area (km²)', 'value'), scale: true }, { ...axis('Ice volume (km³)', 'value'), scale: true, nameGap: 48 }],
      series,
    },
    table: {
      columns: [{ name: 'year', label: 'Year' }, { name: 'ba', label: 'Baseline area (km²)' }, { name: 'va', label: `${variant} area (km²)` }, { name: 'bv', label: 'Baseline volume (km³)' }, { name: 'vv', label: `${variant} volume (km³)` }],
      rows: r.years.map((y, i) => ({ year: y, ba: chartNumber(r.baseline.glacierAreaKm2[i]), va: chartNumber(r.variant.glacierAreaKm2[i]), bv: chartNumber(r.baseline.glacierVolumeKm3[i]), vv: chartNumber(r.variant.glacierVolumeKm3[i]) })),
    },
  };
}

const PEAK_LABEL = (name: string, s: TransientSeries) => `${name}: peak water ${s.peakWater.text}`;

/** Annual glacier runoff and its centred 11-year mean, with each peak-water year marked (Huss & Hock 2018). */
export function glacierRunoffChart(r: TransientResults, variant: string): ChartSpec {
  const series = pair(r, variant).flatMap(({ name, s, style }, i) => [
    { name: `${name}: annual`, type: 'line', showSymbol: false, data: s.glacierRunoffM3.map(million), color: style.color, lineStyle: { color: style.color, width: 1, opacity: 0.5 } },
    {
      name: `${name}: 11-year mean`, type: 'line', showSymbol: false, data: s.smoothedGlacierRunoffM3.map(million), ...style,
      markLine: s.peakWater.status === 'reached' ? {
        symbol: 'none', lineStyle: { color: i === 0 ? style.color : seriesColour(0), type: 'dashed' },
        label: { formatter: PEAK_LABEL(name, s), position: i === 0 ? 'insideEndTop' : 'insideEndBottom' },
        data: [{ xAxis: String(s.peakWater.year) }],
      } : undefined,
    },
  ]);
  return {
    option: { tooltip: TOOLTIP, legend: LEGEND, grid: GRID, xAxis: axis('Year', 'category', years(r)), yAxis: axis('Glacier runoff (million m³ per year)', 'value'), series },
    table: {
      columns: [{ name: 'year', label: 'Year' }, { name: 'b', label: 'Baseline (million m³)' }, { name: 'bs', label: 'Baseline, 11-year mean' }, { name: 'v', label: `${variant} (million m³)` }, { name: 'vs', label: `${variant}, 11-year mean` }],
      rows: r.years.map((y, i) => ({ year: y, b: million(r.baseline.glacierRunoffM3[i]), bs: million(r.baseline.smoothedGlacierRunoffM3[i]), v: million(r.variant.glacierRunoffM3[i]), vs: million(r.variant.smoothedGlacierRunoffM3[i]) })),
    },
  };
}

const SOURCES = [['snow', 'Snow melt'], ['ice', 'Clean-ice melt'], ['debrisIce', 'Melt under debris'], ['rain', 'Rain']] as const;

/** Annual runoff of the variant by source (stacked), with the baseline's total for comparison. */
export function runoffBySourceChart(r: TransientResults, variant: string): ChartSpec {
  const total = (s: TransientSeries) => r.years.map((_, i) => SOURCES.reduce((a, [k]) => a + s.runoffM3[k][i], 0));
  return {
    option: {
      tooltip: { trigger: 'axis', axisPointer: { type: 'shadow' } }, legend: LEGEND, grid: GRID, xAxis: axis('Year', 'category', years(r)), yAxis: axis(`Annual runoff, ${variant} (million m³)`, 'value'),
      series: [
        ...SOURCES.map(([k, label]) => ({ name: label, type: 'bar', stack: 'sources', itemStyle: { color: SURFACE_STYLES[k].colour }, data: r.variant.runoffM3[k].map(million) })),
        { name: 'Baseline total', type: 'line', showSymbol: false, data: total(r.baseline).map(million), lineStyle: { color: INK, width: 2 }, itemStyle: { color: INK } },
      ],
    },
    table: {
      columns: [{ name: 'year', label: 'Year' }, ...SOURCES.map(([k, label]) => ({ name: k, label: `${label} (million m³)` })), { name: 'baseline', label: 'Baseline total (million m³)' }],
      rows: r.years.map((y, i) => ({ year: y, ...Object.fromEntries(SOURCES.map(([k]) => [k, million(r.variant.runoffM3[k][i])])), baseline: million(total(r.baseline)[i]) })),
    },
  };
}

/** Glacier area per band in the first and the last year, for the baseline and the variant: where the glacier goes. */
export function bandGlacierAreaChart(r: TransientResults, variant: string): ChartSpec {
  const labels = r.bands.map((b) => `${Math.round(b.elevationM)} m`);
  const last = r.years.at(-1);
  return {
    option: {
      tooltip: { trigger: 'axis', axisPointer: { type: 'shadow' } }, legend: LEGEND,
      grid: { left: 80, right: 24, top: 40, bottom: 48 },
      xAxis: axis('Glacier area (km²)', 'value'),
      yAxis: { type: 'category', data: labels },
      series: [
        { name: `${r.years[0]}`, type: 'bar', itemStyle: { color: SURFACE_STYLES.snow.colour }, data: r.baseline.bandGlacierAreaKm2.first.map((v) => chartNumber(v)) },
        { name: `${last}, baseline`, type: 'bar', itemStyle: { color: SURFACE_STYLES.ice.colour }, data: r.baseline.bandGlacierAreaKm2.last.map((v) => chartNumber(v)) },
        { name: `${last}, ${variant}`, type: 'bar', itemStyle: { color: seriesColour(1) }, data: r.variant.bandGlacierAreaKm2.last.map((v) => chartNumber(v)) },
      ],
    },
    table: {
      columns: [{ name: 'band', label: 'Band (mean elevation)' }, { name: 'first', label: `${r.years[0]} (km²)` }, { name: 'b', label: `${last}, baseline (km²)` }, { name: 'v', label: `${last}, ${variant} (km²)` }],
      rows: labels.map((band, i) => ({ band, first: chartNumber(r.baseline.bandGlacierAreaKm2.first[i]), b: chartNumber(r.baseline.bandGlacierAreaKm2.last[i]), v: chartNumber(r.variant.bandGlacierAreaKm2.last[i]) })),
    },
  };
}
