import { catchmentContribution, contributionRange, regionalTotal, transientContribution, type CatchmentContribution } from '../../../shared/analysis/regional-totals';
import { csvLine, safeFileName } from '../../../shared/csv/csv-writing';
import type { RegionalResults } from '../../../shared/schemas/studies';
import { TRANSIENT_CAUTIONS } from '../../../shared/analysis/transient-results';
import { CAUTIONS } from '../../../shared/text/cautions';
import { roundSignificant } from '../../../shared/text/numbers';
import { csvFile, type DownloadFile } from '../download-file';
import { loadMembers, loadTransientMembers } from '../runs/run-store';
import type { TenantScope } from '../tenant-scope';
import type { StudyService } from './study-service';

/** What the figures of a study's runs cover, by its step. */
const STEP_NOTES: Record<RegionalResults['step'], string> = {
  month: 'One season: added runoff by month; mean added discharge over each catchment\'s melt season',
  year: 'Multi-decade: added runoff by year; mean added discharge over all the run\'s years',
};

/** Caution of every regional total: catchments are summed, not routed. */
export const REGIONAL_CAUTION = 'Regional totals add the catchments\' own results: water is not routed between them, and catchments that drain into one another would be counted twice.';

/**
 * The regional result of a study: per template, each catchment's added melt (from its run's
 * stored members, the same figures as the run's results), the totals by month (by year for
 * multi-decade runs) and for the region, with ensemble ranges, and the ranking. Only catchments
 * whose runs are done are counted.
 */
export class StudyResults {
  constructor(private readonly studies: StudyService) {}

  async results(scope: TenantScope, studyId: number): Promise<RegionalResults> {
    const study = await this.studies.get(scope, studyId);
    const multiDecade = study.options.transient !== null;
    const contributionOf = async (runId: number) => (multiDecade
      ? transientContribution(await loadTransientMembers(scope, runId))
      : catchmentContribution(await loadMembers(scope, runId)));
    const templates = [];
    for (const template of study.templates) {
      const done = study.catchments.flatMap((c) => {
        const cell = c.cells.find((k) => k.templateId === template.id);
        return cell?.status === 'done' && cell.runId ? [{ catchment: c, runId: cell.runId }] : [];
      });
      const contributions: CatchmentContribution[] = [];
      for (const d of done) contributions.push(await contributionOf(d.runId));
      const total = regionalTotal(contributions);
      const rankOf = new Map(total.ranking.map((position, rank) => [position, rank + 1]));
      templates.push({
        templateId: template.id,
        name: template.name,
        periods: total.periods,
        catchments: total.ranking.map((position) => {
          const c = contributions[position];
          return {
            catchmentId: done[position].catchment.catchmentId, name: done[position].catchment.name, runId: done[position].runId,
            rank: rankOf.get(position)!, addedVolumeM3: c.addedVolumeM3, meanAddedDischargeM3s: c.meanAddedDischargeM3s,
            addedDepthMm: c.addedDepthMm, areaKm2: c.areaKm2, addedVolumeRangeM3: contributionRange(c), addedByPeriodM3: total.byCatchment[position],
          };
        }),
        addedByPeriodM3: total.addedByPeriodM3,
        total: {
          addedVolumeM3: total.addedVolumeM3, meanAddedDischargeM3s: total.meanAddedDischargeM3s,
          addedVolumeRangeM3: total.addedVolumeRangeM3, meanAddedDischargeRangeM3s: total.meanAddedDischargeRangeM3s,
        },
      });
    }
    return {
      study: { id: study.id, name: study.name },
      complete: { done: study.counts.done, of: study.catchments.length },
      step: multiDecade ? 'year' : 'month',
      templates,
      cautions: [...CAUTIONS, ...(multiDecade ? TRANSIENT_CAUTIONS : []), REGIONAL_CAUTION],
    };
  }

  /** The regional table as CSV: header block with the cautions, one row per template × catchment ranked, then the regional total. */
  async csv(scope: TenantScope, studyId: number): Promise<DownloadFile> {
    const r = await this.results(scope, studyId);
    const n = (v: number | null | undefined) => (v === null || v === undefined ? null : roundSignificant(v, 8));
    const periods = [...new Set(r.templates.flatMap((t) => t.periods))].sort();
    const lines = [
      csvLine(['# Tarnish export', 'Regional study: added runoff by catchment']),
      csvLine(['# Study', r.study.name]),
      csvLine(['# Runs', STEP_NOTES[r.step]]),
      csvLine(['# Catchments done', `${r.complete.done} of ${r.complete.of}`]),
      ...r.cautions.map((c) => csvLine(['# Caution', c])),
      csvLine(['Variant', 'Rank', 'Catchment', 'Area (km²)', 'Added volume (m³)', 'Added volume 5 % (m³)', 'Added volume 95 % (m³)',
        'Mean added discharge (m³/s)', 'Added depth (mm w.e.)', ...periods.map((p) => `Added volume ${p} (m³)`)]),
    ];
    for (const t of r.templates) {
      const byPeriod = (values: number[]) => periods.map((p) => n(values[t.periods.indexOf(p)] ?? null));
      for (const c of t.catchments) {
        lines.push(csvLine([t.name, c.rank, c.name, n(c.areaKm2), n(c.addedVolumeM3), n(c.addedVolumeRangeM3?.p5), n(c.addedVolumeRangeM3?.p95),
          n(c.meanAddedDischargeM3s), n(c.addedDepthMm), ...byPeriod(c.addedByPeriodM3)]));
      }
      lines.push(csvLine([t.name, null, 'Region (sum of the catchments)', n(t.catchments.reduce((a, c) => a + c.areaKm2, 0)), n(t.total.addedVolumeM3),
        n(t.total.addedVolumeRangeM3?.p5), n(t.total.addedVolumeRangeM3?.p95), n(t.total.meanAddedDischargeM3s), null, ...byPeriod(t.addedByPeriodM3)]));
    }
    return csvFile(`${safeFileName(r.study.name)}-regional.csv`, `${lines.join('\r\n')}\r\n`);
  }
}
