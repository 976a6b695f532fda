import { SOURCES, type Source } from '../melt/result';
import { refuse } from './errors';
import { updateGlacier, type GlacierUpdateOptions } from './glacier-update';
import { glacierVolumeOf, type GlacierBand, type GlacierState } from './glacier-volume';
import { peakWater, type PeakWater } from './peak-water';
import type { WarmingPath } from './warming-path';

/**
 * A transient run: the engine simulates one year at a time with the glacier of that year, and the
 * glacier is updated between years from the simulated glacier-wide mass balance (Δh method). The
 * engine is injected, so the same loop serves the real engine, a worker and tests.
 */

/** What one scenario year runs with. */
export interface TransientYear {
  year: number;
  /** Year of the station record whose weather is used. */
  recordYear: number;
  temperatureDeltaC: number;
  precipitationFactor: number;
}

/** What the engine reports for one year. */
export interface YearOutcome {
  /** Glacier-wide mass balance, mm w.e. over the year's glacier area. */
  glacierMassBalanceMm: number;
  /** Runoff by source over the year, m³. */
  runoffM3: Record<Source, number>;
  /** Glacier runoff over the year, m³ (melt and rain from the initially glacierised area, as Huss & Hock 2018 count it [memory]). */
  glacierRunoffM3: number;
}

export type YearSimulator = (year: TransientYear, glacierFraction: Float64Array) => YearOutcome;

export interface TransientRow extends TransientYear, YearOutcome {
  /** Glacier area and volume at the start of the year. */
  glacierAreaKm2: number;
  glacierVolumeKm3: number;
  /** Ice volume change from the year's balance, m³. */
  volumeChangeM3: number;
}

export interface TransientResult {
  rows: TransientRow[];
  /** Glacier at the end of the last year. */
  finalGlacier: GlacierState;
  peakWater: PeakWater;
}

/**
 * Pairs the warming path with the record years chosen for each scenario year.
 * @throws HydrologyInputError when there are not as many record years as path years
 */
export function transientYears(path: WarmingPath, recordYears: readonly number[]): TransientYear[] {
  if (recordYears.length !== path.years.length) refuse('recordYears', `${path.years.length} scenario years need as many record years; ${recordYears.length} were given.`);
  return Array.from(path.years, (year, i) => ({ year, recordYear: recordYears[i], temperatureDeltaC: path.temperatureDeltaC[i], precipitationFactor: path.precipitationFactor[i] }));
}

/**
 * Runs the years in order, updating the glacier after each.
 * @param onYear called after each year (progress, cancellation by throwing)
 * @example runTransient(bands, initialGlacier(bands), transientYears(path, recordYearSequence(record, 80, 'resample', 1)), simulateYear).peakWater.year
 */
export function runTransient(bands: readonly GlacierBand[], glacier: GlacierState, years: readonly TransientYear[], simulateYear: YearSimulator, options: GlacierUpdateOptions & { onYear?: (row: TransientRow, index: number) => void } = {}): TransientResult {
  const rows: TransientRow[] = [];
  let state = glacier;
  years.forEach((year, index) => {
    const glacierAreaKm2 = state.areaKm2.reduce((s, a) => s + a, 0);
    const glacierVolumeKm3 = glacierVolumeOf(state);
    const fraction = Float64Array.from(bands, (b, i) => state.areaKm2[i] / b.areaKm2);
    const outcome = simulateYear(year, fraction);
    for (const s of SOURCES) if (!Number.isFinite(outcome.runoffM3[s])) refuse(`years[${index}].runoffM3.${s}`, `the simulation of ${year.year} gave no ${s} runoff.`);
    const update = glacierAreaKm2 > 0 ? updateGlacier(bands, state, outcome.glacierMassBalanceMm, options) : null;
    const row: TransientRow = { ...year, ...outcome, glacierAreaKm2, glacierVolumeKm3, volumeChangeM3: update?.volumeChangeM3 ?? 0 };
    rows.push(row);
    options.onYear?.(row, index);
    if (update) state = update.state;
  });
  return { rows, finalGlacier: state, peakWater: peakWater(rows.map((r) => r.year), rows.map((r) => r.glacierRunoffM3)) };
}
