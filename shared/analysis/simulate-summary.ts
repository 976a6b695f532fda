import { simulate } from '../melt/simulate';
import type { SimulationInput } from '../melt/schema';
import { SOURCES } from '../melt/result';
import type { BandPart } from './band-parts';
import { summariseSimulation, type SimulationSummary } from './simulation-summary';

/** An engine input, optionally split into band groups that each have their own scenario. */
export type MemberInput = SimulationInput & { parts?: BandPart[] | null };

/** Puts the summaries of band groups back together in the catchment's band order. */
export function mergeSummaries(parts: readonly BandPart[], summaries: readonly SimulationSummary[], bandCount: number): SimulationSummary {
  const first = summaries[0];
  const bands = new Array<SimulationSummary['bands'][number]>(bandCount);
  const months: SimulationSummary['months'] = [];
  const dailyM3 = Object.fromEntries(SOURCES.map((s) => [s, new Array<number>(first.dayCount).fill(0)])) as SimulationSummary['dailyM3'];
  parts.forEach((part, k) => {
    const summary = summaries[k];
    part.bandIndices.forEach((b, i) => (bands[b] = summary.bands[i]));
    for (const row of summary.months) months.push({ ...row, bandIndex: part.bandIndices[row.bandIndex] });
    for (const s of SOURCES) summary.dailyM3[s].forEach((v, d) => (dailyM3[s][d] += v));
  });
  months.sort((a, b) => a.bandIndex - b.bandIndex || (a.month < b.month ? -1 : a.month > b.month ? 1 : 0));
  return { startDate: first.startDate, dayCount: first.dayCount, bands, months, dailyM3, start: first.start, shortwaveSource: first.shortwaveSource };
}

/** Simulates one run member (all its band groups) and returns what a run stores. */
export function simulateSummary(input: MemberInput, onProgress?: (fraction: number) => void): SimulationSummary {
  const { parts, ...engineInput } = input;
  if (!parts) return summariseSimulation(simulate(engineInput, { onProgress: (p) => onProgress?.(p.fraction) }));
  const bands = engineInput.catchment.bands;
  const summaries = parts.map((part, k) => summariseSimulation(simulate(
    { ...engineInput, scenario: part.scenario, catchment: { ...engineInput.catchment, bands: part.bandIndices.map((b) => bands[b]) } },
    { onProgress: (p) => onProgress?.((k + p.fraction) / parts.length) },
  )));
  return mergeSummaries(parts, summaries, bands.length);
}
