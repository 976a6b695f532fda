import type { BriefingSnapshot, TableData } from '../../../shared/schemas/briefings';
import { chartTable } from '../../../shared/briefings/chart-table';
import { CALIBRATION_HEADING, CAUTIONS_HEADING } from '../../../shared/text/cautions';
import { csvLine } from '../../../shared/csv/csv-writing';

function tableLines(heading: string, table: TableData): string[] {
  return [
    csvLine([heading]),
    csvLine(table.columns.map((c) => (c.unit ? `${c.label} (${c.unit})` : c.label))),
    ...table.rows.map((row) => csvLine(row)),
    '',
  ];
}

/**
 * The briefing's tables as one CSV file: a header block (briefing, catchment, scenarios, version,
 * input hashes, cautions), then the headline table and every table and chart section's table
 * view, each under its heading. Cells that look like formulas are escaped by csvLine.
 */
export function briefingCsv(s: BriefingSnapshot): string {
  const runs = s.assumptions.runs;
  const header = [
    ['Briefing', s.title],
    ['Organisation', s.organisation],
    ['Catchment', s.catchment.name],
    ['Baseline scenario', s.baselineName],
    ['Variant scenarios', s.headlines.map((h) => h.variantName).join('; ')],
    ['Version', s.version],
    ['Published', s.publishedAt],
    ['Period', `${s.period.from} to ${s.period.to}`],
    ['Engine version', s.assumptions.engineVersion],
    ...runs.map((r) => [`Input hash: ${r.scenarioName}`, r.inputHash]),
    ...s.warnings.map((w, i) => [i === 0 ? CALIBRATION_HEADING : '', w]),
    ...s.assumptions.setUp.flatMap((run) => run.lines.map((l) => [`${l.label}: ${run.scenarioName}`, l.value])),
    ...s.cautions.map((c, i) => [i === 0 ? CAUTIONS_HEADING : '', c]),
  ];
  const headlines: TableData = {
    columns: [
      { label: 'Variant', unit: '' }, { label: 'Added melt volume', unit: 'm³' }, { label: 'low', unit: 'm³' }, { label: 'high', unit: 'm³' },
      { label: 'Added discharge in the melt season', unit: 'm³/s' }, { label: 'Added runoff, % of baseline', unit: '%' },
      { label: 'Timing shift', unit: 'days' }, { label: 'Melt season', unit: '' },
    ],
    rows: s.headlines.map((h) => [
      h.variantName, h.addedVolumeM3.value, h.addedVolumeM3.low, h.addedVolumeM3.high,
      h.addedMeltSeasonDischargeM3s.value, h.addedRunoffPercentOfBaseline.value, h.timingShiftDays.value, h.meltSeason,
    ]),
  };
  const lines = [...header.map((row) => csvLine(row)), '', ...tableLines('Headline numbers', headlines)];
  for (const section of s.sections) {
    if (section.kind === 'table') lines.push(...tableLines(section.heading, section.table));
    if (section.kind === 'chart') lines.push(...tableLines(section.heading, chartTable(section.chart)));
  }
  return lines.join('\r\n');
}
