import { daysBetween } from '../melt/calendar';
import type { BalanceObservations } from '../hydrology/water-balance';
import type { WaterBalanceClosure } from '../schemas/water-balance';
import { formatNumber } from '../text/numbers';
import type { DatedValue } from './paired-series';
import type { StakeObservation } from './stake-balance';

/** Share of the period's days the gauge must have read for its runoff to close a balance on (assumption). */
export const MIN_RUNOFF_COVERAGE = 0.9;
/** A stake reading counts for the period when its start and end lie within this many days of the period's (assumption: balance years are read within a week or two). */
export const STAKE_DATE_TOLERANCE_DAYS = 15;

/**
 * A stated accuracy read from its text: the first "±x %" (or "x %") in it, e.g. "±15 % at high
 * flows" → 15; null when it states none.
 */
export function statedPercent(text: string): number | null {
  const match = /±?\s*(\d+(?:\.\d+)?)\s*%/.exec(text);
  return match ? Number(match[1]) : null;
}

/** A stated accuracy in m w.e., e.g. "±0.2 m w.e." → 200 mm; null when it states none. */
export function statedMillimetresWe(text: string): number | null {
  const match = /±?\s*(\d+(?:\.\d+)?)\s*(mm|m)\s*w\.?\s*e/i.exec(text);
  if (!match) return null;
  return Number(match[1]) * (match[2].toLowerCase() === 'm' ? 1000 : 1);
}

export interface RunoffObservation {
  valueMm: number;
  days: number;
  filledDays: number;
}

/**
 * Measured runoff over the period as a depth over the catchment, mm: the daily discharge (m³ s⁻¹)
 * summed over the days, days without a reading bridged by linear interpolation between the
 * readings either side (the nearest reading at the ends).
 * @throws RangeError naming the coverage when the gauge read fewer than MIN_RUNOFF_COVERAGE of the days
 */
export function runoffDepthMm(observed: readonly DatedValue[], period: { from: string; to: string }, catchmentAreaKm2: number): RunoffObservation {
  const days = daysBetween(period.from, period.to) + 1;
  const values = new Array<number | null>(days).fill(null);
  for (const o of observed) {
    const d = daysBetween(period.from, o.date);
    if (d >= 0 && d < days && Number.isFinite(o.value)) values[d] = o.value;
  }
  const read = values.filter((v) => v !== null).length;
  if (read < MIN_RUNOFF_COVERAGE * days) {
    throw new RangeError(`period: the discharge record has readings on ${read} of the ${days} days from ${period.from} to ${period.to}; a water balance needs at least ${Math.round(MIN_RUNOFF_COVERAGE * 100)} % of them.`);
  }
  let total = 0;
  for (let d = 0; d < days; d++) {
    let v = values[d];
    if (v === null) {
      let before = d - 1;
      while (before >= 0 && values[before] === null) before--;
      let after = d + 1;
      while (after < days && values[after] === null) after++;
      const a = before >= 0 ? values[before]! : null;
      const b = after < days ? values[after]! : null;
      v = a !== null && b !== null ? a + ((b - a) * (d - before)) / (after - before) : (a ?? b)!;
    }
    total += v * 86_400;
  }
  return { valueMm: (total / (catchmentAreaKm2 * 1e6)) * 1000, days, filledDays: days - read };
}

/** Stake readings whose period is the closure's (within STAKE_DATE_TOLERANCE_DAYS at both ends). */
export function stakesForPeriod(readings: readonly StakeObservation[], period: { from: string; to: string }): StakeObservation[] {
  const near = (a: string, b: string) => Math.abs(daysBetween(a, b)) <= STAKE_DATE_TOLERANCE_DAYS;
  return readings.filter((r) => near(r.from, period.from) && near(r.to, period.to));
}

interface Band { lowerM: number; upperM: number; glacierFraction: number }

export interface StakeBands {
  bandBalances: NonNullable<BalanceObservations['bandBalances']>;
  observed: WaterBalanceClosure['observations']['bandBalances'];
  notes: string[];
}

/**
 * Stake balances averaged per band (mm w.e.), each band's uncertainty the stakes' stated accuracy
 * over √n (independent stake errors; common practice). Stakes outside every glacier band are left
 * out and said so.
 */
export function stakeBandBalances(readings: readonly StakeObservation[], bands: readonly Band[], stakeSigmaMm: number): StakeBands {
  const groups = new Map<number, number[]>();
  const notes: string[] = [];
  for (const r of readings) {
    const band = bands.findIndex((b) => r.elevationM >= b.lowerM && r.elevationM < b.upperM);
    if (band < 0 || !(bands[band].glacierFraction > 0)) {
      notes.push(`Stake ${r.stake} at ${formatNumber(r.elevationM, 0)} m lies in no glacier band and is left out.`);
      continue;
    }
    groups.set(band, [...(groups.get(band) ?? []), r.balanceMWe * 1000]);
  }
  const entries = [...groups.entries()].sort((a, b) => a[0] - b[0]);
  const bandBalances = entries.map(([band, values]) => ({
    band, value: values.reduce((s, v) => s + v, 0) / values.length, uncertainty: stakeSigmaMm / Math.sqrt(values.length),
  }));
  const observed = entries.map(([band, values], i) => ({
    band, midM: (bands[band].lowerM + bands[band].upperM) / 2, stakes: values.length, value: bandBalances[i].value, uncertainty: bandBalances[i].uncertainty,
  }));
  return { bandBalances, observed, notes };
}
