import { bandLabel, type BandRow } from '../schemas/catchment-bands';
import type { Series } from '../schemas/datasets';
import type { StakeReading } from '../schemas/stakes';
import { roundTo } from '../text/numbers';
import type { ChartSpec } from './chart-spec';
import { SURFACE_STYLES } from './palette';

/** Each band's area split into ice-free ground, clean glacier ice and debris-covered glacier ice (km²). */
export function hypsometryChart(bands: readonly BandRow[]): ChartSpec {
  const parts = bands.map((b) => {
    const glacier = b.areaKm2 * b.glacierFraction;
    const debris = glacier * b.debrisFraction;
    return { label: bandLabel(b), free: roundTo(b.areaKm2 - glacier, 3), clean: roundTo(glacier - debris, 3), debris: roundTo(debris, 3) };
  });
  const stack = (name: string, key: 'free' | 'clean' | 'debris', colour: string) =>
    ({ name, type: 'bar', stack: 'area', data: parts.map((p) => p[key]), itemStyle: { color: colour } });
  return {
    option: {
      tooltip: { trigger: 'axis', axisPointer: { type: 'shadow' } },
      legend: { top: 0 },
      grid: { left: 110, right: 24, top: 32, bottom: 36 },
      xAxis: { type: 'value', name: 'Area (km²)', nameLocation: 'middle', nameGap: 24 },
      yAxis: { type: 'category', data: parts.map((p) => p.label) },
      series: [
        stack('Ice-free', 'free', SURFACE_STYLES.iceFree.colour),
        stack('Clean ice', 'clean', SURFACE_STYLES.ice.colour),
        stack('Debris-covered ice', 'debris', SURFACE_STYLES.debrisIce.colour),
      ],
    },
    table: {
      columns: [
        { name: 'band', label: 'Band' }, { name: 'free', label: 'Ice-free (km²)' },
        { name: 'clean', label: 'Clean ice (km²)' }, { name: 'debris', label: 'Debris-covered ice (km²)' },
      ],
      rows: parts.map((p) => ({ band: p.label, free: p.free, clean: p.clean, debris: p.debris })),
    },
  };
}

/**
 * A stored series as it was recorded. Missing steps are null and connectNulls is off, so gaps show
 * as breaks in the line; totals (precipitation) are bars.
 */
export function seriesChart(series: Series | null, how: { label: string; unit: string; statistic: 'mean' | 'total' }): ChartSpec {
  const times = series?.times ?? [];
  return {
    option: {
      tooltip: { trigger: 'axis' },
      grid: { left: 56, right: 24, top: 24, bottom: 72 },
      xAxis: { type: 'category', data: times, boundaryGap: how.statistic === 'total' },
      yAxis: { type: 'value', name: how.unit, scale: how.statistic === 'mean' },
      dataZoom: [{ type: 'inside' }, { type: 'slider', bottom: 16 }],
      series: [{
        name: how.label,
        type: how.statistic === 'total' ? 'bar' : 'line',
        data: series?.values ?? [],
        connectNulls: false,
        showSymbol: false,
        sampling: 'lttb',
        lineStyle: { width: 1 },
        large: true,
      }],
    },
    table: {
      columns: [{ name: 'time', label: 'Time' }, { name: 'value', label: `${how.label} (${how.unit})` }],
      rows: times.map((time, i) => ({ time, value: series!.values[i] })),
    },
  };
}

/** One point series per period, balance (x) against elevation (y), as glaciologists plot balance profiles. */
export function stakeReadingsChart(readings: readonly StakeReading[]): ChartSpec {
  const periodOf = (r: StakeReading) => `${r.from} to ${r.to}`;
  const periods = [...new Set(readings.map(periodOf))];
  return {
    option: {
      tooltip: { trigger: 'item', formatter: (p: { seriesName: string; value: [number, number, string] }) => `${p.value[2]}, ${p.seriesName}<br>${p.value[1]} m: ${p.value[0]} m w.e.` },
      legend: { top: 0 },
      grid: { left: 64, right: 24, top: 64, bottom: 48 },
      xAxis: { type: 'value', name: 'Balance (m w.e.)', nameLocation: 'middle', nameGap: 28 },
      yAxis: { type: 'value', name: 'Elevation (m)', scale: true, axisLine: { onZero: false } },
      series: periods.map((period) => ({
        name: period,
        type: 'scatter',
        data: readings.filter((r) => periodOf(r) === period).map((r) => [r.balanceMWe, r.elevationM, r.stake]),
      })),
    },
    table: {
      columns: [
        { name: 'stake', label: 'Stake' }, { name: 'elevationM', label: 'Elevation (m)' }, { name: 'from', label: 'From' },
        { name: 'to', label: 'To' }, { name: 'balanceMWe', label: 'Balance (m w.e.)' },
      ],
      rows: readings.map((r) => ({ ...r })),
    },
  };
}
