import type PDFDocument from 'pdfkit';
import SVGtoPDF from 'svg-to-pdfkit';
import type { TableData } from '../../../../shared/schemas/briefings';
import { formatNumber } from '../../../../shared/text/numbers';
import { CHART_FONT_FAMILY, FONTS } from './fonts';

type Doc = InstanceType<typeof PDFDocument>;

export const PAGE_MARGIN = 56;
export const INK = '#1d2731';
export const MUTED = '#5b6770';

export const contentWidth = (doc: Doc) => doc.page.width - 2 * PAGE_MARGIN;
const roomLeft = (doc: Doc) => doc.page.height - PAGE_MARGIN - doc.y;

/** Starts a new page unless `height` points still fit on this one. */
export function ensureRoom(doc: Doc, height: number): void {
  if (roomLeft(doc) < height) doc.addPage();
}

export function heading(doc: Doc, text: string, size = 15): void {
  ensureRoom(doc, size * 4);
  doc.moveDown(0.6).font(FONTS.bold.name).fontSize(size).fillColor(INK).text(text, PAGE_MARGIN, doc.y, { width: contentWidth(doc) });
  doc.moveDown(0.3);
}

export function paragraph(doc: Doc, text: string, options: { size?: number; color?: string; bold?: boolean } = {}): void {
  doc.font(options.bold ? FONTS.bold.name : FONTS.regular.name).fontSize(options.size ?? 10).fillColor(options.color ?? INK)
    .text(text, PAGE_MARGIN, doc.y, { width: contentWidth(doc), lineGap: 2 });
  doc.moveDown(0.4);
}

/** A chart's SVG placed as vectors, with text mapped onto the embedded fonts. */
export function svgFigure(doc: Doc, svg: string, width: number, height: number): void {
  ensureRoom(doc, height + 10);
  const top = doc.y;
  SVGtoPDF(doc, svg, PAGE_MARGIN, top, {
    width, height, assumePt: true,
    fontCallback: (family: string, bold: boolean) => (family.includes(CHART_FONT_FAMILY) && bold ? FONTS.bold.name : FONTS.regular.name),
  });
  doc.x = PAGE_MARGIN;
  doc.y = top + height + 6;
}

const cellText = (v: string | number | null) => (typeof v === 'number' ? formatNumber(v, 3) : v ?? '–');

/** A label and its value side by side; the next line starts below the taller of the two. */
export function labelledLine(doc: Doc, label: string, value: string, o: { labelWidth: number; indent: number; bold: boolean }): void {
  const top = doc.y;
  const left = PAGE_MARGIN + o.indent;
  doc.font(FONTS.regular.name).fontSize(10).fillColor(MUTED).text(label, left, top, { width: o.labelWidth });
  const labelBottom = doc.y;
  doc.font(o.bold ? FONTS.bold.name : FONTS.regular.name).fontSize(10).fillColor(INK)
    .text(value, left + o.labelWidth + 10, top, { width: contentWidth(doc) - o.labelWidth - 10 - o.indent });
  doc.x = PAGE_MARGIN;
  doc.y = Math.max(labelBottom, doc.y) + 4;
}

/** Columns with no value in any row (no ensemble, so no range) are left out of the printed table. */
function withoutEmptyColumns(data: TableData): TableData {
  const keep = data.columns.map((_, i) => i === 0 || data.rows.some((r) => r[i] !== null));
  return { columns: data.columns.filter((_, i) => keep[i]), rows: data.rows.map((r) => r.filter((_, i) => keep[i])) };
}

/** A simple ruled table; the font shrinks with the number of columns and long tables continue on new pages. */
export function table(doc: Doc, full: TableData): void {
  const data = withoutEmptyColumns(full);
  const width = contentWidth(doc);
  const size = data.columns.length > 8 ? 6.5 : data.columns.length > 5 ? 7.5 : 9;
  const colWidth = width / data.columns.length;
  // Numbers line up on the right, words on the left.
  const numeric = data.columns.map((_, i) => data.rows.some((r) => typeof r[i] === 'number'));
  const drawRow = (cells: string[], bold: boolean) => {
    doc.font(bold ? FONTS.bold.name : FONTS.regular.name).fontSize(size);
    const height = Math.max(...cells.map((c) => doc.heightOfString(c, { width: colWidth - 4 }))) + 4;
    ensureRoom(doc, height + 2);
    const top = doc.y;
    cells.forEach((c, i) => doc.fillColor(INK).text(c, PAGE_MARGIN + i * colWidth + 2, top + 2, { width: colWidth - 4, align: numeric[i] ? 'right' : 'left' }));
    doc.moveTo(PAGE_MARGIN, top + height).lineTo(PAGE_MARGIN + width, top + height).lineWidth(0.4).strokeColor('#c4ccd2').stroke();
    doc.x = PAGE_MARGIN;
    doc.y = top + height;
  };
  drawRow(data.columns.map((c) => (c.unit ? `${c.label} (${c.unit})` : c.label)), true);
  for (const row of data.rows) drawRow(row.map(cellText), false);
  doc.moveDown(0.6);
}

/** "Page i of n" on every page but the title page; needs `bufferPages: true`. */
export function pageNumbers(doc: Doc, footer: string): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    if (i === range.start) continue;
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0; // writing inside the margin must not open a new page
    doc.font(FONTS.regular.name).fontSize(8).fillColor(MUTED)
      .text(`${footer} · Page ${i + 1} of ${range.count}`, PAGE_MARGIN, doc.page.height - PAGE_MARGIN / 2 - 8, { width: contentWidth(doc), align: 'center', lineBreak: false });
    doc.page.margins.bottom = bottom;
  }
}
