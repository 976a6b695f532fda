import {
  SNAPSHOT_FORMAT, briefingSnapshotSchema, type BriefingSnapshot, type DraftSection, type SnapshotSection,
} from '../../../shared/schemas/briefings';
import { CAUTIONS } from '../../../shared/text/cautions';
import type { ComparisonForBriefing } from './comparison';
import { headlineOf, resultChart, resultTable } from './result-views';
import { setUpLines } from '../../../shared/analysis/run-set-up';
import { regionalView } from '../../../shared/briefings/regional-views';
import type { RegionalResults } from '../../../shared/schemas/studies';

export interface AssembleInput {
  title: string;
  summary: string;
  sections: DraftSection[];
  version: number;
  publishedAt: Date;
  publishedBy: string;
  organisation: string;
  catchment: BriefingSnapshot['catchment'];
  comparison: ComparisonForBriefing;
  /** The results of the regional studies the sections show, by study id (none without regional sections). */
  regional?: Map<number, RegionalResults>;
}

function frozenSection(section: DraftSection, c: ComparisonForBriefing, regional: Map<number, RegionalResults>): SnapshotSection {
  switch (section.kind) {
    case 'regional': {
      const view = regionalView(section.contentKey, regional.get(section.studyId)!);
      const heading = section.heading;
      const caption = section.caption || `From the regional study "${regional.get(section.studyId)!.study.name}".`;
      return 'chart' in view ? { kind: 'chart', heading, caption, chart: view.chart } : { kind: 'table', heading, caption, table: view.table };
    }
    case 'chart':
      return { kind: 'chart', heading: section.heading, caption: section.caption, chart: resultChart(section.contentKey, c) };
    case 'table':
      return { kind: 'table', heading: section.heading, caption: section.caption, table: resultTable(section.contentKey, c) };
    case 'text':
      return { kind: 'text', heading: section.heading, markdown: section.bodyMarkdown };
  }
}

/**
 * Copies everything a version shows — numbers, chart data, assumptions, sources with their
 * accuracy, engine versions and input hashes — into one snapshot, so later runs never change it.
 * The cautions are not part of the draft: every snapshot carries them, last.
 */
export function assembleSnapshot(input: AssembleInput): BriefingSnapshot {
  const c = input.comparison;
  const first = c.runs[0].results;
  const lastDay = new Date(Date.parse(`${first.startDate}T00:00:00Z`) + (first.dayCount - 1) * 86_400_000).toISOString().slice(0, 10);
  const snapshot: BriefingSnapshot = {
    format: SNAPSHOT_FORMAT,
    title: input.title,
    summary: input.summary,
    version: input.version,
    publishedAt: input.publishedAt.toISOString(),
    publishedBy: input.publishedBy,
    organisation: input.organisation,
    catchment: input.catchment,
    period: { from: first.startDate, to: lastDay },
    baselineName: c.baselineName,
    headlines: c.runs.map((r) => headlineOf(r.results)),
    sections: input.sections.map((s) => frozenSection(s, c, input.regional ?? new Map())),
    assumptions: {
      scenarios: [
        { name: c.baselineName, role: 'baseline', values: c.baselineValues },
        ...c.runs.map((r) => ({ name: r.results.run.scenarioName, role: 'variant' as const, values: r.scenarioValues })),
      ],
      parameters: c.parameters,
      dataSources: c.dataSources,
      runs: c.runs.map(({ results: { run } }) => ({
        id: run.id, scenarioName: run.scenarioName, engineVersion: run.engineVersion, inputHash: run.inputHash,
        finishedAt: run.finishedAt ?? '', ensembleSize: run.ensembleSize,
      })),
      engineVersion: [...new Set(c.runs.map((r) => r.results.run.engineVersion))].join(', '),
      setUp: c.runs.map(({ results }) => ({
        scenarioName: results.run.scenarioName,
        lines: setUpLines(results.setUp).map(([label, value]) => ({ label, value })),
      })),
    },
    warnings: [...new Set(c.runs.filter((r) => r.results.setUp.calibration.status !== 'calibrated').map((r) => `${r.results.run.scenarioName}: ${r.results.setUp.calibration.message}`))],
    // The standard cautions first, then what any of the runs adds, each once.
    cautions: [...new Set([...CAUTIONS, ...c.runs.flatMap((r) => r.results.cautions), ...[...(input.regional?.values() ?? [])].flatMap((r) => r.cautions)])],
  };
  // Deep copy through JSON, checked against the schema: nothing shared with live objects survives.
  return briefingSnapshotSchema.parse(JSON.parse(JSON.stringify(snapshot)));
}
