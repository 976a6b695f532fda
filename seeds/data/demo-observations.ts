import { seededRandom } from '../../shared/analysis/random';
import { addDays } from '../../shared/melt/calendar';
import { simulateDischarge } from '../../shared/lab/calibrate';
import { siteWith } from '../../shared/lab/calibration-set';
import { compareStakes } from '../../shared/lab/stake-balance';
import type { StakeReading } from '../../shared/schemas/stakes';
import { demoEngineInput, DEMO_RECORD } from './demo-forcing';
import { DEMO_TRUTH } from './demo-truth';
import { normal } from './synthetic-station';

/**
 * The demo's "measured" discharge and stake balances, made consistent with the model: the engine
 * runs the demo catchment with the hidden parameters of DEMO_TRUTH, then measurement error is
 * laid on top, as a gauge and a stake network would add it.
 *  - Discharge (daily, m³/s): each hydrological year simulated after its spin-up, times
 *    exp(ε), ε an AR(1) error with φ = 0.8 and σ = 0.08 (rating-curve drift and day-to-day
 *    scatter), plus a 12-day gauge outage in August of the second year. Stated accuracy ±15 %.
 *  - Stakes (m w.e., 1 October – 30 September): the simulated point balance at eight stakes on
 *    the glacier for each year, plus a normal error of σ = 0.1 m w.e. Stated accuracy ±0.2 m w.e.
 * Deterministic: the same seed every time.
 */
export interface DemoObservations {
  dailyDischarge: { times: string[]; values: number[] };
  stakes: StakeReading[];
}

const STAKES = [3900, 4100, 4300, 4500, 4700, 4900, 5100, 5300].map((elevationM, i) => ({ stake: `SV-${i + 1}`, elevationM }));
/** The record's three balance years, 1 October to 30 September. */
export const DEMO_BALANCE_YEARS = [
  { from: '2021-10-01', to: '2022-09-30' }, { from: '2022-10-01', to: '2023-09-30' }, { from: '2023-10-01', to: '2024-09-30' },
];
const OUTAGE = { from: addDays(DEMO_RECORD.start, 365 + 305), days: 12 };

let cached: DemoObservations | null = null;

export function demoObservations(): DemoObservations {
  if (cached) return cached;
  const truth = siteWith(demoEngineInput(), DEMO_TRUTH);
  const random = seededRandom(20240930);
  const times: string[] = [];
  const values: number[] = [];
  let error = 0;
  for (const year of DEMO_BALANCE_YEARS) {
    const sim = simulateDischarge(truth, year);
    sim.values.forEach((q, d) => {
      error = 0.8 * error + 0.08 * Math.sqrt(1 - 0.64) * normal(random);
      const date = addDays(sim.startDate, d);
      const inOutage = date >= OUTAGE.from && date < addDays(OUTAGE.from, OUTAGE.days);
      if (inOutage) return;
      times.push(`${date} 00:00`);
      values.push(Math.round(q * Math.exp(error) * 100) / 100);
    });
  }
  const readings = DEMO_BALANCE_YEARS.flatMap((year) => STAKES.map((s) => ({ ...s, from: year.from, to: year.to, balanceMWe: 0 })));
  const simulated = compareStakes(truth, readings).readings;
  const stakes = simulated.map((r) => ({
    stake: r.stake, elevationM: r.elevationM, from: r.from, to: r.to,
    balanceMWe: Math.round((r.simulatedMWe + 0.1 * normal(random)) * 100) / 100,
  }));
  cached = { dailyDischarge: { times, values }, stakes };
  return cached;
}
