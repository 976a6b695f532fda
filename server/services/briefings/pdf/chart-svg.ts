import * as echarts from 'echarts';
import PDFDocument from 'pdfkit';
import type { ChartData } from '../../../../shared/schemas/briefings';
import { briefingChartOption } from '../../../../shared/charts/briefing-chart';
import { CHART_FONT_FAMILY, FONTS } from './fonts';

/**
 * Without a canvas ECharts guesses text widths; the PDF sets the text in the embedded font, so
 * legends and labels are laid out with that font's real metrics instead.
 */
const metrics = new PDFDocument({ autoFirstPage: false });
metrics.registerFont(FONTS.regular.name, FONTS.regular.file);
metrics.registerFont(FONTS.bold.name, FONTS.bold.file);
echarts.setPlatformAPI({
  measureText(text: string, font?: string) {
    const size = Number(/(\d+(?:\.\d+)?)px/.exec(font ?? '')?.[1] ?? 12);
    const bold = /\bbold\b|\b[6-9]00\b/.test(font ?? '');
    return { width: metrics.font(bold ? FONTS.bold.name : FONTS.regular.name).fontSize(size).widthOfString(text) };
  },
});

/**
 * A briefing chart as an SVG string, drawn by ECharts' server-side renderer (no DOM, no canvas):
 * the same option the browser uses, without animation, in the embedded font.
 */
export function chartSvg(chart: ChartData, width: number, height: number): string {
  const instance = echarts.init(null, null, { renderer: 'svg', ssr: true, width, height });
  try {
    instance.setOption({
      ...briefingChartOption(chart, { animation: false }),
      textStyle: { fontFamily: CHART_FONT_FAMILY, fontSize: 10 },
      tooltip: { show: false },
    });
    return instance.renderToSVGString();
  } finally {
    instance.dispose();
  }
}
