/**
 * The ECharts parts an option draws with beyond those every chart on screen has (line and bar
 * series on a grid, the tooltip, a plain legend). The browser loads each part the first time a
 * chart asks for it (src/boot/echarts.ts), so a page downloads only the chart code it uses.
 */
export const EXTRA_CHART_PARTS = [
  'scatter', 'heatmap', 'markLine', 'markPoint', 'markArea',
  'dataZoomInside', 'dataZoomSlider', 'legendScroll', 'visualMapContinuous', 'visualMapPiecewise',
] as const;
export type ExtraChartPart = (typeof EXTRA_CHART_PARTS)[number];

/** Series types drawn by the parts every chart has. */
const BASE_SERIES = ['line', 'bar'];
const EXTRA_SERIES: readonly string[] = ['scatter', 'heatmap'] satisfies ExtraChartPart[];
const MARKERS = ['markLine', 'markPoint', 'markArea'] as const satisfies ExtraChartPart[];

type Entry = Record<string, unknown>;
/** ECharts takes a component or series either alone or as a list. */
const entries = (value: unknown): Entry[] => (Array.isArray(value) ? value : value && typeof value === 'object' ? [value] : []) as Entry[];

/**
 * The extra parts `option` needs, each once. The types ECharts gives an entry that names none are
 * those of its own type defaulters: a data zoom without a type is a slider; a visual map is
 * piecewise with categories, pieces or (not calculable) a split number, else continuous.
 * A series type no part draws is a programming error, thrown so that it shows in tests.
 */
export function extraChartParts(option: Record<string, unknown>): ExtraChartPart[] {
  const parts = new Set<ExtraChartPart>();
  for (const series of entries(option.series)) {
    const type = String(series.type);
    if (EXTRA_SERIES.includes(type)) parts.add(type as ExtraChartPart);
    else if (!BASE_SERIES.includes(type)) throw new Error(`No chart part draws series of type "${type}": add it to shared/charts/chart-parts.ts and src/boot/echarts.ts.`);
    for (const marker of MARKERS) if (series[marker]) parts.add(marker);
  }
  for (const zoom of entries(option.dataZoom)) parts.add(zoom.type === 'inside' ? 'dataZoomInside' : 'dataZoomSlider');
  for (const legend of entries(option.legend)) if (legend.type === 'scroll') parts.add('legendScroll');
  for (const map of entries(option.visualMap)) parts.add(isPiecewise(map) ? 'visualMapPiecewise' : 'visualMapContinuous');
  return [...parts];
}

function isPiecewise(map: Entry): boolean {
  if (map.type) return map.type === 'piecewise';
  if (map.categories) return true;
  const split = Array.isArray(map.pieces) ? map.pieces.length > 0 : Number(map.splitNumber) > 0;
  return split && !map.calculable;
}
