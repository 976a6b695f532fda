import { simulate } from '../melt/simulate';
import type { Parameters } from '../melt/parameters';
import type { SimulationInput } from '../melt/schema';
import { PARAMETER_NAMES, PARAMETER_SPECS, type ParameterName } from '../melt/parameters';
import { addDays } from '../melt/calendar';
import { catchmentInput, forcingDays } from './calibration-set';
import type { LabSite, Period } from './site';

/** Scenario changes a sweep can vary, with their allowed ranges (the engine's scenario schema). */
export const SCENARIO_SWEEP_SPECS = {
  temperatureDeltaC: { label: 'Temperature change', min: -15, max: 15, unit: '°C' },
  precipitationFactor: { label: 'Precipitation change factor', min: 0, max: 5, unit: '×' },
  blackCarbonSnowNgG: { label: 'Black carbon in snow', min: 0, max: 50_000, unit: 'ng/g' },
  blackCarbonIceNgG: { label: 'Black carbon on ice', min: 0, max: 50_000, unit: 'ng/g' },
  dustSnowUgG: { label: 'Dust in snow', min: 0, max: 5_000, unit: 'µg/g' },
  dustIceUgG: { label: 'Dust on ice', min: 0, max: 5_000, unit: 'µg/g' },
  debrisThicknessChangeM: { label: 'Debris thickness change', min: -10, max: 10, unit: 'm' },
  debrisExtentChange: { label: 'Debris extent change', min: 0, max: 1, unit: 'of clean ice' },
} as const;
export type ScenarioSweepKey = keyof typeof SCENARIO_SWEEP_SPECS;
export const SWEEP_VARIABLES = [...Object.keys(SCENARIO_SWEEP_SPECS) as ScenarioSweepKey[], ...PARAMETER_NAMES];
export type SweepVariable = ScenarioSweepKey | ParameterName;

/** Largest number of values on one axis (a 20 × 20 grid at most). */
export const MAX_SWEEP_STEPS = 20;

export interface SweepAxis {
  variable: SweepVariable;
  from: number;
  to: number;
  steps: number;
}

export interface SweepPlan {
  axes: SweepAxis[];
  period: Period;
}

export function isScenarioKey(variable: SweepVariable): variable is ScenarioSweepKey {
  return variable in SCENARIO_SWEEP_SPECS;
}

export function variableSpec(variable: SweepVariable): { label: string; min: number; max: number; unit: string } {
  if (isScenarioKey(variable)) return SCENARIO_SWEEP_SPECS[variable];
  const { min, max, unit } = PARAMETER_SPECS[variable];
  return { label: variable, min, max, unit };
}

/** Evenly spaced values from `from` to `to`, both included. */
export function axisValues(axis: SweepAxis): number[] {
  if (!Number.isInteger(axis.steps) || axis.steps < 2 || axis.steps > MAX_SWEEP_STEPS) throw new RangeError(`a sweep axis needs 2 to ${MAX_SWEEP_STEPS} steps`);
  return Array.from({ length: axis.steps }, (_, i) => axis.from + ((axis.to - axis.from) * i) / (axis.steps - 1));
}

/** One grid cell: its indices along each axis and the values there. */
export interface SweepCell {
  index: number[];
  values: number[];
}

export function sweepCells(plan: SweepPlan): SweepCell[] {
  const [first, second] = plan.axes.map(axisValues);
  if (!second) return first.map((v, i) => ({ index: [i], values: [v] }));
  return first.flatMap((v, i) => second.map((w, j) => ({ index: [i, j], values: [v, w] })));
}

/**
 * What every cell of a sweep starts from: the site and plan, and the state (snowpack, its
 * temperatures, grains and impurities) that a baseline run (parameters in force, no scenario
 * change, spun up through the record before it) has reached by the start of the period. Swept
 * values act within the period only, so one season is one short run per cell.
 */
export interface SweepSetup {
  site: LabSite;
  plan: SweepPlan;
  start: NonNullable<SimulationInput['start']>;
}

/** Runs the baseline up to the day before the period to get the state the cells start from. */
export function prepareSweep(site: LabSite, plan: SweepPlan): SweepSetup {
  if (plan.period.from <= site.forcing.start) return { site, plan, start: { method: 'spin-up', years: 1 } };
  const lastDay = addDays(plan.period.from, -1);
  const from = addDays(lastDay, -364) > site.forcing.start ? addDays(lastDay, -364) : site.forcing.start;
  const r = simulate(catchmentInput(site, { from, to: lastDay }));
  return { site, plan, start: { method: 'state', state: r.endState } };
}

/** Catchment melt (snow and ice) over a run, mm w.e. averaged over the catchment area. */
export function catchmentMelt(input: SimulationInput): number {
  const r = simulate(input);
  let volume = 0;
  for (const source of ['snow', 'ice', 'debrisIce'] as const) {
    for (const v of r.catchmentDaily.volumeM3[source]) volume += v;
  }
  const area = r.bands.areaM2.reduce((s, a) => s + a, 0);
  return (volume / area) * 1000;
}

/** The engine input of one cell: the site's parameters and precipitation factor with the swept values applied. */
export function cellInput(setup: SweepSetup, values: readonly number[]): SimulationInput {
  const { site, plan } = setup;
  const scenario: Record<string, number> = {};
  const parameters: Partial<Parameters> = { ...site.parameters };
  plan.axes.forEach(({ variable }, k) => {
    if (!isScenarioKey(variable)) parameters[variable] = values[k];
  });
  const last = addDays(site.forcing.start, forcingDays(site.forcing) - 1);
  const input = catchmentInput({ ...site, parameters }, { from: plan.period.from, to: plan.period.to < last ? plan.period.to : last });
  plan.axes.forEach(({ variable }, k) => {
    // The swept precipitation factor multiplies the one in force (with the water-balance correction, if used).
    if (isScenarioKey(variable)) scenario[variable] = variable === 'precipitationFactor' ? values[k] * (input.scenario!.precipitationFactor as number) : values[k];
  });
  return { ...input, scenario: { ...input.scenario, ...scenario }, start: setup.start };
}

export function cellMelt(setup: SweepSetup, values: readonly number[]): number {
  return catchmentMelt(cellInput(setup, values));
}

/** Melt with the parameters in force and no scenario change, from the same snowpack. */
export function baselineMelt(setup: SweepSetup): number {
  return cellMelt({ ...setup, plan: { ...setup.plan, axes: [] } }, []);
}

export interface SweepResult {
  axes: { variable: SweepVariable; label: string; unit: string; values: number[] }[];
  period: Period;
  /** Melt with the parameters in force and no scenario change, mm w.e. */
  baselineMeltMm: number;
  /** Per cell (one-axis sweeps: one row), mm w.e.: melt and melt minus the baseline. */
  meltMm: number[][];
  addedMeltMm: number[][];
}

/** Puts the cell melts (in sweepCells order) on the grid. */
export function assembleSweep(plan: SweepPlan, baselineMeltMm: number, melts: readonly number[]): SweepResult {
  const axes = plan.axes.map((axis) => ({ variable: axis.variable, ...variableSpec(axis.variable), values: axisValues(axis) }));
  const columns = axes[1]?.values.length ?? axes[0].values.length;
  const rows = axes[1] ? axes[0].values.length : 1;
  const meltMm = Array.from({ length: rows }, (_, i) => melts.slice(i * columns, (i + 1) * columns));
  return { axes, period: plan.period, baselineMeltMm, meltMm, addedMeltMm: meltMm.map((row) => row.map((m) => m - baselineMeltMm)) };
}

/** Runs every cell in this thread (workers split the cells among themselves instead). */
export function runSweep(site: LabSite, plan: SweepPlan, options: { signal?: AbortSignal; onProgress?: (done: number, total: number) => void } = {}): SweepResult {
  const setup = prepareSweep(site, plan);
  const cells = sweepCells(plan);
  const melts = cells.map((cell, k) => {
    options.signal?.throwIfAborted();
    const melt = cellMelt(setup, cell.values);
    options.onProgress?.(k + 1, cells.length);
    return melt;
  });
  return assembleSweep(plan, baselineMelt(setup), melts);
}
