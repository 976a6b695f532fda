import type { BandRow } from '../schemas/catchment-bands';
import type { Derivation, ElevationChange, SnowCoverMap } from '../schemas/geodata';
import { roundTo } from '../text/numbers';
import { formatPeriod } from '../text/format';
import type { ChartSpec } from './chart-spec';
import { axisNameAlong, legendAndGrid } from './chart-style';
import { lineStyle } from './palette';

/**
 * A profile chart: a quantity (x) against elevation (y), as hypsometry and balance profiles are
 * drawn, its legend of the series' names wrapping above the plot, the axis names along the axes.
 */
export function profileChart(xName: string, series: readonly ({ name: string } & Record<string, unknown>)[]) {
  return {
    tooltip: { trigger: 'item' },
    ...legendAndGrid(series.map((s) => s.name)),
    xAxis: { type: 'value', ...axisNameAlong(xName, 'x') },
    yAxis: { type: 'value', ...axisNameAlong('Elevation (m)', 'y'), scale: true },
    series,
  };
}

/**
 * Hypsometry of the table in use beside the one derived from the DEM: area per 100 m of
 * elevation (km²), so bands of different widths and the DEM's 50 m steps compare on one axis.
 */
export function hypsometryComparisonChart(current: readonly BandRow[], derived: Derivation['hypsometry']): ChartSpec {
  const ranges = (rows: readonly { lowerM: number; upperM: number; areaKm2: number }[]) => {
    const merged: { lowerM: number; upperM: number; areaKm2: number }[] = [];
    for (const r of rows) {
      const last = merged.at(-1);
      if (last && last.lowerM === r.lowerM && last.upperM === r.upperM) last.areaKm2 += r.areaKm2;
      else merged.push({ lowerM: r.lowerM, upperM: r.upperM, areaKm2: r.areaKm2 });
    }
    return merged;
  };
  const steps = (rows: { lowerM: number; upperM: number; areaKm2: number }[]) =>
    rows.flatMap((r) => [[roundTo((r.areaKm2 * 100) / (r.upperM - r.lowerM), 3), r.lowerM], [roundTo((r.areaKm2 * 100) / (r.upperM - r.lowerM), 3), r.upperM]]);
  const now = ranges(current);
  return {
    option: profileChart('Area per 100 m of elevation (km²)', [
      { name: 'Table in use', type: 'line', data: steps(now), showSymbol: false, ...lineStyle(0, true) },
      { name: 'Derived from the DEM (50 m steps)', type: 'line', data: steps(derived), showSymbol: false, ...lineStyle(1) },
    ]),
    table: {
      columns: [{ name: 'lowerM', label: 'From (m)' }, { name: 'upperM', label: 'To (m)' }, { name: 'areaKm2', label: 'Derived area (km²)' }, { name: 'glacierKm2', label: 'Glacier (km²)' }, { name: 'debrisKm2', label: 'Debris-covered ice (km²)' }],
      rows: derived.map((h) => ({ lowerM: h.lowerM, upperM: h.upperM, areaKm2: roundTo(h.areaKm2, 3), glacierKm2: roundTo(h.glacierAreaKm2, 3), debrisKm2: roundTo(h.debrisAreaKm2, 3) })),
    },
  };
}

/** Snow-covered fraction by band (rows) and map date (columns); grey where clouds or gaps hid the whole band. */
export function snowCoverChart(maps: readonly SnowCoverMap[]): ChartSpec {
  const bands = maps[0]?.rows.map((r) => `${r.lowerM}–${r.upperM} m`) ?? [];
  const dates = maps.map((m) => m.observedOn);
  const data = maps.flatMap((m, x) => m.rows.map((r, y) => [x, y, r.snowCoveredFraction === null ? '-' : roundTo(r.snowCoveredFraction * 100, 1)]));
  return {
    option: {
      tooltip: { position: 'top' },
      grid: { left: 110, right: 24, top: 16, bottom: 90 },
      xAxis: { type: 'category', data: dates, name: 'Map date', nameLocation: 'middle', nameGap: 28, splitArea: { show: true } },
      yAxis: { type: 'category', data: bands, splitArea: { show: true } },
      visualMap: { min: 0, max: 100, calculable: false, orient: 'horizontal', left: 'center', bottom: 0, text: ['100 % snow', '0 %'], inRange: { color: ['#8c6d46', '#f4f1ea', '#4a90d9'] } },
      series: [{ name: 'Snow-covered fraction (%)', type: 'heatmap', data, label: { show: false } }],
    },
    table: {
      columns: [{ name: 'date', label: 'Map date' }, { name: 'band', label: 'Band' }, { name: 'snow', label: 'Snow-covered (% of the seen area)' }, { name: 'valid', label: 'Seen (% of band)' }, { name: 'cloud', label: 'Cloud (% of band)' }],
      rows: maps.flatMap((m) => m.rows.map((r) => ({
        date: m.observedOn, band: `${r.lowerM}–${r.upperM} m`, snow: r.snowCoveredFraction === null ? null : roundTo(r.snowCoveredFraction * 100, 1),
        valid: roundTo(r.validFraction * 100, 1), cloud: roundTo(r.cloudFraction * 100, 1),
      }))),
    },
  };
}

/** Geodetic balance profile: balance (m w.e. per year, ± 1 σ) against band elevation, as balance profiles are drawn. */
export function geodeticBalanceChart(change: ElevationChange): ChartSpec {
  const mid = (r: { lowerM: number; upperM: number }) => (r.lowerM + r.upperM) / 2;
  return {
    option: profileChart('Balance (m w.e. per year)', [
      { name: `Geodetic balance ${formatPeriod(change.fromDate, change.toDate)}`, type: 'line', data: change.rows.map((r) => [roundTo(r.balanceMwePerYear, 3), mid(r)]), ...lineStyle(0) },
      { name: '− 1 σ', type: 'line', data: change.rows.map((r) => [roundTo(r.balanceMwePerYear - r.balanceSigmaMwePerYear, 3), mid(r)]), showSymbol: false, ...lineStyle(1, true), lineStyle: { type: 'dotted', width: 1 } },
      { name: '+ 1 σ', type: 'line', data: change.rows.map((r) => [roundTo(r.balanceMwePerYear + r.balanceSigmaMwePerYear, 3), mid(r)]), showSymbol: false, ...lineStyle(1, true), lineStyle: { type: 'dotted', width: 1 } },
    ]),
    table: {
      columns: [
        { name: 'band', label: 'Band' }, { name: 'glacier', label: 'Glacier (km²)' }, { name: 'covered', label: 'With data (% of glacier)' },
        { name: 'dhdt', label: 'Elevation change (m per year)' }, { name: 'balance', label: 'Balance (m w.e. per year)' }, { name: 'sigma', label: '± 1 σ (m w.e. per year)' },
      ],
      rows: change.rows.map((r) => ({
        band: `${r.lowerM}–${r.upperM} m`, glacier: roundTo(r.glacierAreaKm2, 3), covered: roundTo(r.coveredFraction * 100, 1), dhdt: roundTo(r.dhdtMPerYear, 3),
        balance: roundTo(r.balanceMwePerYear, 3), sigma: roundTo(r.balanceSigmaMwePerYear, 3),
      })),
    },
  };
}
