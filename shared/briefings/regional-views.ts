import type { ChartData, RegionalKey, TableData } from '../schemas/briefings';
import { PERIOD_NAMES, type RegionalResults } from '../schemas/studies';
import { roundSignificant } from '../text/numbers';

const MILLION = 1e6;
const m3 = (v: number) => roundSignificant(v / MILLION, 4);

/** The catchments of a study's result, ranked by the first variant's added runoff. */
function catchmentOrder(results: RegionalResults): { id: number; name: string }[] {
  const seen = new Map<number, string>();
  for (const t of results.templates) for (const c of t.catchments) if (!seen.has(c.catchmentId)) seen.set(c.catchmentId, c.name);
  return [...seen].map(([id, name]) => ({ id, name }));
}

/** A regional study's result frozen for a briefing: a chart (by catchment, or by month or year) or the regional table. */
export function regionalView(key: RegionalKey, results: RegionalResults): { chart: ChartData } | { table: TableData } {
  const catchments = catchmentOrder(results);
  if (key === 'regional-by-catchment') {
    return {
      chart: {
        type: 'bar', xName: 'Catchment', yName: 'Added runoff', unit: 'million m³', categories: catchments.map((c) => c.name),
        series: results.templates.map((t) => {
          const of = (id: number) => t.catchments.find((c) => c.catchmentId === id);
          const ranged = t.catchments.some((c) => c.addedVolumeRangeM3);
          return {
            name: t.name,
            values: catchments.map((c) => { const x = of(c.id); return x ? m3(x.addedVolumeM3) : null; }),
            ...(ranged ? {
              low: catchments.map((c) => { const r = of(c.id)?.addedVolumeRangeM3; return r ? m3(r.p5) : null; }),
              high: catchments.map((c) => { const r = of(c.id)?.addedVolumeRangeM3; return r ? m3(r.p95) : null; }),
            } : {}),
          };
        }),
      },
    };
  }
  if (key === 'regional-by-period') {
    const periods = [...new Set(results.templates.flatMap((t) => t.periods))].sort();
    return {
      chart: {
        type: 'bar', xName: PERIOD_NAMES[results.step], yName: 'Added runoff of the region', unit: 'million m³', categories: periods,
        series: results.templates.map((t) => ({ name: t.name, values: periods.map((p) => { const k = t.periods.indexOf(p); return k < 0 ? null : m3(t.addedByPeriodM3[k]); }) })),
      },
    };
  }
  const range = (r: { p5: number; p95: number } | null) => (r ? `${m3(r.p5)} to ${m3(r.p95)}` : '');
  // Range columns only for a study with an ensemble.
  const ranged = results.templates.some((t) => t.total.addedVolumeRangeM3);
  const cells = (volume: number | null, r: { p5: number; p95: number } | null) => (ranged ? [volume, volume === null ? '' : range(r)] : [volume]);
  return {
    table: {
      columns: [{ label: 'Catchment', unit: '' }, ...results.templates.flatMap((t) => [
        { label: `${t.name}: added runoff`, unit: 'million m³' }, ...(ranged ? [{ label: `${t.name}: 5–95 % of the ensemble`, unit: 'million m³' }] : []),
      ])],
      rows: [
        ...catchments.map((c) => [c.name, ...results.templates.flatMap((t) => {
          const x = t.catchments.find((k) => k.catchmentId === c.id);
          return x ? cells(m3(x.addedVolumeM3), x.addedVolumeRangeM3) : cells(null, null);
        })]),
        ['Region (sum of the catchments)', ...results.templates.flatMap((t) => cells(m3(t.total.addedVolumeM3), t.total.addedVolumeRangeM3))],
      ],
    },
  };
}
