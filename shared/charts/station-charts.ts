import type { StationComparison } from '../schemas/stations';
import { axis, chartNumber, GRID, LEGEND, TOOLTIP, ZOOM, type ChartSpec } from './chart-spec';
import { lineStyle } from './palette';

/** Two records of one variable over the days both hold, without merging them. */
export function stationComparisonChart(c: StationComparison): ChartSpec {
  const name = (r: StationComparison['first']) => `${r.stationName}${r.network ? ` (${r.network})` : ''}`;
  const bar = c.statistic === 'total';
  return {
    option: {
      tooltip: TOOLTIP, legend: LEGEND, grid: GRID, dataZoom: ZOOM,
      xAxis: axis('Date', 'category', c.dates),
      yAxis: { ...axis(`${c.variableLabel} (${c.unit})`, 'value'), scale: !bar },
      series: [c.firstValues, c.secondValues].map((values, i) => ({
        name: name(i === 0 ? c.first : c.second), type: bar ? 'bar' : 'line', showSymbol: false, data: values.map((v) => chartNumber(v)), ...lineStyle(i),
      })),
    },
    table: {
      columns: [{ name: 'date', label: 'Date' }, { name: 'a', label: `${name(c.first)} (${c.unit})` }, { name: 'b', label: `${name(c.second)} (${c.unit})` }],
      rows: c.dates.map((date, i) => ({ date, a: chartNumber(c.firstValues[i]), b: chartNumber(c.secondValues[i]) })),
    },
  };
}
