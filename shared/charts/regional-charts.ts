import { PERIOD_NAMES, type RegionalResults, type RegionalTemplate } from '../schemas/studies';
import { axis, chartNumber, GRID, LEGEND, type ChartSpec } from './chart-spec';
import { TOOLTIP } from './chart-style';

const MILLION = 1e6;
/** Catchments drawn one by one in the monthly chart; the rest are summed as one. */
const SHOWN = 8;

/** Added volume by catchment, ranked (million m³), with the 5–95 % ensemble range in the table and as whiskers. */
export function regionalCatchmentChart(template: RegionalTemplate): ChartSpec {
  const names = template.catchments.map((c) => c.name);
  const ranged = template.catchments.some((c) => c.addedVolumeRangeM3);
  return {
    option: {
      tooltip: TOOLTIP,
      legend: LEGEND,
      grid: GRID,
      // Every catchment named, slanted so long names fit.
      xAxis: { ...axis('Catchment (ranked by added runoff)', 'category', names), axisLabel: { interval: 0, rotate: 25 }, nameGap: 70 },
      yAxis: axis('Added runoff (million m³)', 'value'),
      series: [
        { name: template.name, type: 'bar', data: template.catchments.map((c) => chartNumber(c.addedVolumeM3 / MILLION)) },
        ...(ranged ? [{
          name: '5–95 % of the ensemble', type: 'candlestick', barWidth: 6,
          data: template.catchments.map((c) => {
            const r = c.addedVolumeRangeM3;
            return r ? [r.p5, r.p95, r.p5, r.p95].map((v) => chartNumber(v / MILLION)) : [null, null, null, null];
          }),
          itemStyle: { color: 'transparent', borderColor: '#333', color0: 'transparent', borderColor0: '#333' },
        }] : []),
      ],
    },
    table: {
      columns: [
        { name: 'rank', label: 'Rank' }, { name: 'catchment', label: 'Catchment' }, { name: 'volume', label: 'Added runoff (million m³)' },
        { name: 'low', label: '5 % (million m³)' }, { name: 'high', label: '95 % (million m³)' }, { name: 'discharge', label: 'Mean added discharge (m³/s)' },
      ],
      rows: template.catchments.map((c) => ({
        rank: c.rank, catchment: c.name, volume: chartNumber(c.addedVolumeM3 / MILLION),
        low: c.addedVolumeRangeM3 ? chartNumber(c.addedVolumeRangeM3.p5 / MILLION) : null,
        high: c.addedVolumeRangeM3 ? chartNumber(c.addedVolumeRangeM3.p95 / MILLION) : null,
        discharge: chartNumber(c.meanAddedDischargeM3s),
      })),
    },
  };
}

/** Added runoff of the region by month, or by year of multi-decade runs (million m³), stacked by catchment: the largest few, then the rest. */
export function regionalPeriodChart(template: RegionalTemplate, step: RegionalResults['step']): ChartSpec {
  const shown = template.catchments.slice(0, SHOWN);
  const rest = template.catchments.slice(SHOWN);
  const series = [
    ...shown.map((c) => ({ name: c.name, values: c.addedByPeriodM3 })),
    ...(rest.length ? [{ name: `${rest.length} other catchments`, values: template.periods.map((_, k) => rest.reduce((a, c) => a + c.addedByPeriodM3[k], 0)) }] : []),
  ];
  const period = PERIOD_NAMES[step];
  return {
    option: {
      tooltip: TOOLTIP,
      legend: LEGEND,
      grid: GRID,
      xAxis: axis(period, 'category', template.periods),
      yAxis: axis('Added runoff (million m³)', 'value'),
      series: series.map((s) => ({ name: s.name, type: 'bar', stack: 'region', data: s.values.map((v) => chartNumber(v / MILLION)) })),
    },
    table: {
      columns: [{ name: 'period', label: period }, ...series.map((s, i) => ({ name: `s${i}`, label: `${s.name} (million m³)` })), { name: 'total', label: 'Region (million m³)' }],
      rows: template.periods.map((p, k) => ({
        period: p, ...Object.fromEntries(series.map((s, i) => [`s${i}`, chartNumber(s.values[k] / MILLION)])), total: chartNumber(template.addedByPeriodM3[k] / MILLION),
      })),
    },
  };
}
