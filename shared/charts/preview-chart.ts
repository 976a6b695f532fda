import { addDays } from '../melt/calendar';
import { roundTo } from '../text/numbers';
import type { ChartSpec } from './chart-spec';
import { lineStyle } from './palette';

/** The scenario builder's preview: cumulative melt of one band, baseline against the scenario (mm w.e.). */
export function previewChart(outcome: { startDate: string; baselineCumulative: number[]; scenarioCumulative: number[] }): ChartSpec {
  const dates = outcome.baselineCumulative.map((_, d) => addDays(outcome.startDate, d));
  return {
    option: {
      tooltip: { trigger: 'axis' },
      legend: { top: 0 },
      grid: { left: 70, right: 20, top: 30, bottom: 40 },
      xAxis: { type: 'category', data: dates, name: 'Date', nameLocation: 'middle', nameGap: 28 },
      yAxis: { type: 'value', name: 'Cumulative melt (mm w.e.)', nameLocation: 'middle', nameGap: 55 },
      series: [
        { name: 'Baseline', type: 'line', showSymbol: false, data: outcome.baselineCumulative, ...lineStyle(0, true) },
        { name: 'This scenario', type: 'line', showSymbol: false, data: outcome.scenarioCumulative, ...lineStyle(1) },
      ],
    },
    table: {
      columns: [{ name: 'date', label: 'Date' }, { name: 'baseline', label: 'Baseline (mm w.e.)' }, { name: 'scenario', label: 'This scenario (mm w.e.)' }],
      rows: dates.map((date, d) => ({ date, baseline: roundTo(outcome.baselineCumulative[d], 1), scenario: roundTo(outcome.scenarioCumulative[d], 1) })),
    },
  };
}
