import { formatDatesIn, formatQuantity, formatYearMonth } from '../text/format';
import { GUIDE_GREY, INK, REFERENCE_GREY } from './palette';

/**
 * The style every chart shares, on screen and in the PDF: a legend that wraps onto more lines
 * (never pages: arrows do nothing on paper), numbers in tooltips and on axes without float noise,
 * and the light and dark themes (legend, axes, grid lines, tooltip). Colours of series come from
 * palette.ts.
 */

/** Tooltip and axis numbers as everywhere else in the app: significant figures, no exponent. */
export const chartValue = (value: unknown): string => (typeof value === 'number' ? formatQuantity(value) : String(value ?? ''));

/** A category as a person reads it: ISO days and months in the display locale (a chart's table and CSV keep them as ISO). */
export const categoryLabel = (value: unknown): string => formatYearMonth(formatDatesIn(String(value ?? '')));
/** The tooltip heading of a category axis, written as the axis' labels are. */
export const CATEGORY_POINTER = { label: { formatter: (p: { value: unknown }) => categoryLabel(p.value) } };

export const TOOLTIP = { trigger: 'axis', valueFormatter: chartValue } as const;
export const BAR_TOOLTIP = { trigger: 'axis', axisPointer: { type: 'shadow' }, valueFormatter: chartValue } as const;

const LEGEND_ROW_PX = 22;
const LEGEND_ITEM_PX = 34;
const CHAR_PX = 6.6;

/**
 * A plain legend that wraps, and the grid top that leaves room for its rows at `widthPx` (the
 * narrowest width the chart is drawn at: a phone's 390 px on screen, the page width in the PDF).
 */
export function wrappingLegend(names: readonly string[], widthPx: number, gridTop = 56): { legend: Record<string, unknown>; top: number } {
  const usable = widthPx * 0.92;
  let rows = 1;
  let used = 0;
  for (const name of names) {
    const item = LEGEND_ITEM_PX + name.length * CHAR_PX;
    if (used > 0 && used + item > usable) {
      rows += 1;
      used = 0;
    }
    used += item;
  }
  return { legend: { type: 'plain', top: 0, left: 'center', width: '92%', itemGap: 12 }, top: Math.max(gridTop, 24 + rows * LEGEND_ROW_PX) };
}

/** The narrowest width a chart is drawn at on screen: a phone's. */
export const NARROWEST_CHART_PX = 390;

/**
 * Legend and grid of a chart with a legend above it: the legend wraps (`wrappingLegend`) and the
 * grid starts below its rows at the narrowest width, so long series names never run into the plot.
 */
export function legendAndGrid(names: readonly string[], widthPx = NARROWEST_CHART_PX): { legend: Record<string, unknown>; grid: { left: number; right: number; top: number; bottom: number } } {
  const { legend, top } = wrappingLegend(names, widthPx, 32);
  return { legend, grid: { left: 80, right: 24, top, bottom: 56 } };
}

/**
 * An axis name along the middle of its axis (turned for the vertical one), as `axis()` in
 * chart-spec.ts places them: a name at the top of a vertical axis sits in the legend's rows.
 */
export const axisNameAlong = (name: string, direction: 'x' | 'y') => ({ name, nameLocation: 'middle', nameGap: direction === 'y' ? 56 : 28 }) as const;

const axisColours = (text: string, line: string, split: string) => ({
  axisLine: { lineStyle: { color: line } },
  axisTick: { lineStyle: { color: line } },
  axisLabel: { color: text },
  splitLine: { lineStyle: { color: split } },
  nameTextStyle: { color: text },
});

/** Dark mode's chart theme (registered as 'tarnish-dark'): light text on the dark card, muted grid lines; contrast ≥ 4.5:1 for text. */
export const DARK_CHART_THEME = {
  backgroundColor: 'transparent',
  textStyle: { color: '#dfe6eb' },
  title: { textStyle: { color: '#eef2f5' } },
  legend: { textStyle: { color: '#dfe6eb' }, inactiveColor: '#6b7780', pageTextStyle: { color: '#dfe6eb' } },
  tooltip: { backgroundColor: '#222c33', borderColor: '#4a5963', textStyle: { color: '#eef2f5' } },
  categoryAxis: axisColours('#c9d3da', '#7d8b95', '#36434c'),
  valueAxis: axisColours('#c9d3da', '#7d8b95', '#36434c'),
  timeAxis: axisColours('#c9d3da', '#7d8b95', '#36434c'),
  logAxis: axisColours('#c9d3da', '#7d8b95', '#36434c'),
  dataZoom: { textStyle: { color: '#c9d3da' }, borderColor: '#4a5963', fillerColor: 'rgba(169, 200, 222, 0.2)' },
  visualMap: { textStyle: { color: '#dfe6eb' } },
} as const;
export const DARK_CHART_THEME_NAME = 'tarnish-dark';

/**
 * The ink colours of the palette as dark mode draws them: black observations and the grey
 * baseline and guides would all but vanish on the dark card (the series colours read on both).
 * Downloads and PDFs keep the light colours.
 */
const ON_DARK_CARD: Record<string, string> = { [INK]: '#eef2f5', [REFERENCE_GREY]: '#b7c3cb', [GUIDE_GREY]: '#8f9ba3' };

/**
 * The option with the palette's ink colours lightened for the dark card (a copy). In a series'
 * data only points given as objects (which may carry a style) are looked at; plain values and
 * [x, y] pairs, thousands of them in an hourly series, are passed on as they are.
 */
export function forDarkCard<T>(option: T): T {
  const walk = (value: unknown, key = ''): unknown => {
    if (typeof value === 'string') return ON_DARK_CARD[value.toLowerCase()] ?? value;
    if (value === null || typeof value !== 'object' || ArrayBuffer.isView(value)) return value;
    if (Array.isArray(value)) {
      return key === 'data' ? value.map((point) => (point !== null && typeof point === 'object' && !Array.isArray(point) ? walk(point) : point)) : value.map((v) => walk(v));
    }
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, walk(v, k)]));
  };
  return walk(option) as T;
}
