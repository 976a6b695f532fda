/**
 * Benchmark of the hydrology steps the engine will call: the daily redistribution (avalanching and
 * wind drift) on 30 bands over 50 years of days, routing 50 years of daily runoff, and 50 annual Δh
 * updates. Run: `npx tsx shared/hydrology/bench/hydrology-bench.ts`. Prints the figures; the last
 * line is one JSON object. Invented inputs; nothing is asserted (figures, not tests).
 */
import { seededRandom } from '../../analysis/random';
import { avalanche, planAvalanching } from '../avalanche';
import { updateGlacier } from '../glacier-update';
import { initialGlacier } from '../glacier-volume';
import { routeRunoff } from '../runoff-routing';
import { planWindDrift, windDrift } from '../wind-drift';

const BANDS = 30;
const DAYS = 50 * 365;
const random = seededRandom(1);
const bands = Array.from({ length: BANDS }, (_, i) => ({ lowerM: 2500 + 100 * i, upperM: 2600 + 100 * i, areaKm2: 1 + 4 * random(), slopeDeg: 15 + 35 * random(), glacierFraction: i > 12 ? 0.5 : 0 }));

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function time(runs: number, work: () => void): number {
  work();
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    work();
    times.push(performance.now() - t0);
  }
  return median(times);
}

const snowfall = Float64Array.from({ length: BANDS * DAYS }, () => (random() < 0.3 ? 20 * random() : 0));
const avalanchePlan = planAvalanching(bands);
const windPlan = planWindDrift(bands, bands.map(() => 0.5 + random()));
const swe = new Float64Array(BANDS);
const net = new Float64Array(BANDS);
const daySnow = new Float64Array(BANDS);
const redistributionMs = time(5, () => {
  swe.fill(0);
  for (let d = 0; d < DAYS; d++) {
    for (let b = 0; b < BANDS; b++) {
      daySnow[b] = snowfall[b * DAYS + d];
      swe[b] = swe[b] * 0.995 + daySnow[b];
    }
    windDrift(windPlan, daySnow, swe, net);
    avalanche(avalanchePlan, swe, net);
  }
});
const bandDays = BANDS * DAYS;
console.log(`redistribution (wind drift + avalanching), ${BANDS} bands × ${DAYS} days: ${redistributionMs.toFixed(1)} ms median → ${(bandDays / redistributionMs / 1000).toFixed(1)} M band-days/s`);

const series = () => Float64Array.from({ length: DAYS }, () => 1e5 * random());
const runoff = { snow: series(), ice: series(), debrisIce: series(), rain: series() };
const routingMs = time(5, () => { routeRunoff(runoff); });
console.log(`routing 4 sources × ${DAYS} days: ${routingMs.toFixed(1)} ms median`);

const glacier = initialGlacier(bands);
const updateMs = time(5, () => {
  let state = glacier;
  for (let y = 0; y < 50; y++) state = updateGlacier(bands, state, -700).state;
});
console.log(`50 annual Δh updates on ${BANDS} bands: ${updateMs.toFixed(2)} ms median`);
console.log(JSON.stringify({ redistributionMsFor50Years: +redistributionMs.toFixed(2), routingMsFor50Years: +routingMs.toFixed(2), deltaHMsFor50Years: +updateMs.toFixed(2) }));
