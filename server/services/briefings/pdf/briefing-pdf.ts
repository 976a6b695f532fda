import PDFDocument from 'pdfkit';
import type { BriefingSnapshot, Headline } from '../../../../shared/schemas/briefings';
import { TIMING_NOTE, formatRanged, scaleRanged } from '../../../../shared/briefings/format';
import { formatNumber } from '../../../../shared/text/numbers';
import { formatDatesIn, formatPeriod } from '../../../../shared/text/format';
import { CALIBRATION_HEADING, CAUTIONS_HEADING } from '../../../../shared/text/cautions';
import { chartSvg } from './chart-svg';
import { FONTS } from './fonts';
import { MUTED, PAGE_MARGIN, contentWidth, ensureRoom, heading, labelledLine, pageNumbers, paragraph, svgFigure, table } from './layout';
import { markdownBlocks } from './markdown-blocks';

type Doc = InstanceType<typeof PDFDocument>;

const CHART_HEIGHT = 260;
const dateOf = (iso: string) => new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

function titlePage(doc: Doc, s: BriefingSnapshot): void {
  doc.y = 150;
  paragraph(doc, s.organisation.toUpperCase(), { size: 10, color: MUTED, bold: true });
  doc.font(FONTS.bold.name).fontSize(26).fillColor('#12324a').text(s.title, PAGE_MARGIN, doc.y, { width: contentWidth(doc) });
  doc.moveDown(1);
  paragraph(doc, 'Added snow and glacier melt from darkening surfaces — briefing', { size: 12, color: MUTED });
  doc.moveDown(1.5);
  const c = s.catchment;
  const facts: [string, string][] = [
    ['Catchment', c.name],
    ['Location', `${formatNumber(c.latitudeDeg, 3)}°, ${formatNumber(c.longitudeDeg, 3)}° · ${c.bandCount} elevation bands · ${formatNumber(c.areaKm2, 1)} km²`],
    ['Period simulated', formatPeriod(s.period.from, s.period.to)],
    ['Version', `${s.version}`],
    ['Date', dateOf(s.publishedAt)],
    ['Published by', s.publishedBy],
    ['Organisation', s.organisation],
  ];
  for (const [label, value] of facts) labelledLine(doc, label, value, { labelWidth: 120, indent: 0, bold: false });
}

function headlineBlock(doc: Doc, h: Headline): void {
  ensureRoom(doc, 110);
  paragraph(doc, `${h.variantName}`, { bold: true, size: 11 });
  const lines: [string, string][] = [
    ['Added melt volume', `${formatRanged(scaleRanged(h.addedVolumeM3, 1e-6), 2)} million m³`],
    [`Added discharge in the melt season (${formatDatesIn(h.meltSeason)})`, `${formatRanged(h.addedMeltSeasonDischargeM3s, 3)} m³/s`],
    ['Added runoff, % of baseline', `${formatRanged(h.addedRunoffPercentOfBaseline, 1)} %`],
    [`Timing shift (${TIMING_NOTE})`, `${formatRanged(h.timingShiftDays, 1)} days`],
  ];
  for (const [label, value] of lines) labelledLine(doc, label, value, { labelWidth: 250, indent: 10, bold: true });
  doc.moveDown(0.5);
}

function narrative(doc: Doc, markdown: string): void {
  for (const block of markdownBlocks(markdown)) {
    if (block.kind === 'heading') paragraph(doc, block.text, { bold: true, size: 11 });
    else if (block.kind === 'paragraph') paragraph(doc, block.text);
    else if (block.kind === 'code') paragraph(doc, block.text, { size: 9, color: MUTED });
    else block.items.forEach((item, i) => paragraph(doc, `${block.ordered ? `${i + 1}.` : '•'} ${item}`));
  }
}

function assumptions(doc: Doc, s: BriefingSnapshot): void {
  const a = s.assumptions;
  heading(doc, 'Assumptions');
  for (const sc of a.scenarios) {
    paragraph(doc, `${sc.role === 'baseline' ? 'Baseline' : 'Variant'}: ${sc.name}`, { bold: true });
    paragraph(doc, sc.values.map((v) => `${v.label}: ${v.value}`).join(' · ') || 'No changes', { size: 9 });
  }
  if (a.parameters.length) table(doc, { columns: [{ label: 'Model parameter', unit: '' }, { label: 'Value', unit: '' }], rows: a.parameters.map((p) => [p.label, p.value]) });
  if (a.dataSources.length) {
    table(doc, {
      columns: [{ label: 'Data source', unit: '' }, { label: 'Variables', unit: '' }, { label: 'Origin', unit: '' }, { label: 'Stated accuracy', unit: '' }],
      rows: a.dataSources.map((d) => [d.name, d.variables, d.source, d.accuracy]),
    });
  }
  table(doc, {
    columns: [{ label: 'Run', unit: '' }, { label: 'Engine version', unit: '' }, { label: 'Input hash', unit: '' }, { label: 'Ensemble members', unit: '' }],
    rows: a.runs.map((r) => [`${r.scenarioName} (#${r.id})`, r.engineVersion, r.inputHash, r.ensembleSize]),
  });
  if (a.setUp.length) {
    table(doc, {
      columns: [{ label: 'Run set-up', unit: '' }, { label: 'Item', unit: '' }, { label: 'Value', unit: '' }],
      rows: a.setUp.flatMap((run) => run.lines.map((l, i) => [i === 0 ? run.scenarioName : '', l.label, formatDatesIn(l.value)])),
    });
  }
}

/** The briefing version as a PDF: title page, headline numbers, sections in order, assumptions, cautions last. */
export function briefingPdf(s: BriefingSnapshot): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4', margin: PAGE_MARGIN, bufferPages: true,
    info: { Title: s.title, Author: s.organisation, Subject: `Briefing for ${s.catchment.name}, version ${s.version}` },
  });
  doc.registerFont(FONTS.regular.name, FONTS.regular.file);
  doc.registerFont(FONTS.bold.name, FONTS.bold.file);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  titlePage(doc, s);
  doc.addPage();
  heading(doc, 'Headline numbers', 17);
  paragraph(doc, `Each variant against the baseline “${s.baselineName}”. Ranges in brackets are the 5–95 % spread of the ensemble where one was run.`, { size: 9, color: MUTED });
  if (s.warnings.length) {
    heading(doc, CALIBRATION_HEADING);
    s.warnings.forEach((w) => paragraph(doc, `• ${formatDatesIn(w)}`, { bold: true }));
  }
  s.headlines.forEach((h) => headlineBlock(doc, h));
  if (s.summary.trim()) {
    heading(doc, 'Summary');
    narrative(doc, s.summary);
  }
  for (const section of s.sections) {
    // Keep a chart's heading on the same page as the chart.
    if (section.kind === 'chart') ensureRoom(doc, CHART_HEIGHT + 60);
    heading(doc, section.heading);
    if (section.kind === 'chart') {
      const width = contentWidth(doc);
      svgFigure(doc, chartSvg(section.chart, Math.round(width), CHART_HEIGHT), width, CHART_HEIGHT);
      if (section.caption) paragraph(doc, section.caption, { size: 9, color: MUTED });
    } else if (section.kind === 'table') {
      table(doc, section.table);
      if (section.caption) paragraph(doc, section.caption, { size: 9, color: MUTED });
    } else narrative(doc, section.markdown);
  }
  assumptions(doc, s);
  // The cautions stay together on one page (about 30 pt a line of text).
  ensureRoom(doc, 60 + 30 * s.cautions.length);
  heading(doc, CAUTIONS_HEADING);
  s.cautions.forEach((c) => paragraph(doc, `• ${c}`));
  pageNumbers(doc, `${s.title} · version ${s.version}`);
  doc.end();
  return done;
}
