import {
  SNAPSHOT_FORMAT, briefingSnapshotSchema, type BriefingSnapshot, type DraftSection, type SnapshotSection,
} from '../../../shared/schemas/briefings';
import { CAUTIONS } from '../../../shared/text/cautions';
import type { ComparisonForBriefing } from './comparison';
import { resultChart, resultTable } from './result-views';

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
}

function frozenSection(section: DraftSection, c: ComparisonForBriefing): SnapshotSection {
  switch (section.kind) {
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
  const runs = [c.baseline, ...c.variants];
  const snapshot: BriefingSnapshot = {
    format: SNAPSHOT_FORMAT,
    title: input.title,
    summary: input.summary,
    version: input.version,
    publishedAt: input.publishedAt.toISOString(),
    publishedBy: input.publishedBy,
    organisation: input.organisation,
    catchment: input.catchment,
    period: c.period,
    baselineName: c.baseline.scenarioName,
    headlines: c.variants.map((v) => ({ variantName: v.scenarioName, ...v.headline })),
    sections: input.sections.map((s) => frozenSection(s, c)),
    assumptions: {
      scenarios: runs.map((r, i) => ({ name: r.scenarioName, role: i === 0 ? 'baseline' : 'variant', values: r.scenarioValues })),
      parameters: c.parameters,
      dataSources: c.dataSources,
      runs: runs.map((r) => ({
        id: r.id, scenarioName: r.scenarioName, engineVersion: r.engineVersion, inputHash: r.inputHash,
        finishedAt: r.finishedAt, ensembleSize: r.ensembleSize,
      })),
      engineVersion: [...new Set(runs.map((r) => r.engineVersion))].join(', '),
    },
    cautions: [...CAUTIONS],
  };
  // Deep copy through JSON, checked against the schema: nothing shared with live objects survives.
  return briefingSnapshotSchema.parse(JSON.parse(JSON.stringify(snapshot)));
}
