import { describe, expect, it } from 'vitest';
import type { ChartData } from '../schemas/briefings';
import { briefingChartOption } from './briefing-chart';

type Axis = { axisLabel?: { interval?: number; rotate?: number } };
const xAxisOf = (chart: ChartData) => briefingChartOption(chart).xAxis as Axis;

const bars = (categories: string[]): ChartData => ({
  type: 'bar', xName: 'Catchment', yName: 'Added runoff', unit: 'million m³', categories,
  series: [{ name: 'Soot', values: categories.map((_, i) => i + 1) }],
});

describe('briefing chart option', () => {
  it('names every bar, slanting long names such as catchments\'', () => {
    const catchments = xAxisOf(bars(['Upper Sarvel glacier catchment', 'Kolvi side valley', 'Tashgar glacier catchment', 'Orvan headwater', 'Munel cirques']));
    expect(catchments.axisLabel).toEqual({ interval: 0, rotate: 25 });
    const months = xAxisOf(bars(['2024-05', '2024-06', '2024-07']));
    expect(months.axisLabel).toEqual({ interval: 0 });
  });

  it('leaves a daily line to ECharts\' own label spacing', () => {
    const days = Array.from({ length: 120 }, (_, d) => `2024-05-${String(d).padStart(3, '0')}`);
    const line: ChartData = { ...bars(days), type: 'line', xName: 'Date' };
    expect(xAxisOf(line).axisLabel).toBeUndefined();
  });
});
