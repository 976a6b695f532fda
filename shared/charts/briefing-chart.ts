import type { ChartData } from '../schemas/briefings';
import { CATEGORY_POINTER, TOOLTIP, categoryLabel, wrappingLegend } from './chart-style';
import { SERIES_COLOURS, seriesColour } from './palette';

/**
 * The ECharts option for a frozen briefing chart. Plain data, no DOM: the browser draws it with
 * vue-echarts and the server renders it to SVG for the PDF, so both show the same picture.
 * Ensemble ranges (low/high) are drawn as thin dashed lines beside their series.
 */
export function briefingChartOption(chart: ChartData, options: { animation?: boolean } = {}): Record<string, unknown> {
  const series: Record<string, unknown>[] = [];
  chart.series.forEach((s, i) => {
    const color = seriesColour(i);
    series.push({ name: s.name, type: chart.type, data: s.values, itemStyle: { color }, lineStyle: { color, width: 1.5 }, showSymbol: false });
    for (const [edge, values] of [['5 %', s.low], ['95 %', s.high]] as const) {
      if (!values) continue;
      series.push({
        name: `${s.name} (${edge})`, type: 'line', data: values, showSymbol: false,
        lineStyle: { color, width: 1, type: 'dashed' }, itemStyle: { color },
      });
    }
  });
  const legend = wrappingLegend(series.map((s) => String(s.name)), 480, 40);
  // Every bar is named (ECharts would drop labels that crowd); long names, such as catchments', are slanted to fit.
  const named = chart.type === 'bar';
  const slanted = named && chart.categories.some((c) => String(c).length > 12);
  return {
    // Left out unless asked for, so the page's own setting (none in browser tests) applies.
    ...(options.animation === undefined ? {} : { animation: options.animation }),
    color: [...SERIES_COLOURS],
    // Wraps for as many series as the briefing has; the PDF draws the chart at about this width.
    grid: { left: 64, right: 16, top: legend.top, bottom: slanted ? 110 : 48 },
    legend: legend.legend,
    tooltip: TOOLTIP,
    xAxis: {
      type: 'category', name: chart.xName, nameLocation: 'middle', nameGap: slanted ? 90 : 30, data: chart.categories,
      axisLabel: { formatter: categoryLabel, ...(named ? { interval: 0, ...(slanted ? { rotate: 25 } : {}) } : {}) },
      axisPointer: CATEGORY_POINTER,
    },
    yAxis: { type: 'value', name: chart.unit ? `${chart.yName} (${chart.unit})` : chart.yName, nameLocation: 'middle', nameGap: 48 },
    series,
  };
}
