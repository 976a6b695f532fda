/**
 * Benchmark of the melt engine: an invented 30-band catchment, 10 years hourly (≈ 2.6 M band-hours),
 * run by the engine and, in the same process, by the naive version of the same physics
 * (scripts/bench/naive-engine.ts). Prints the figures; the last line is one JSON object:
 *   {"bandHoursPerSecond": …, "naiveRatio": …, "heapMB": …}
 * bandHoursPerSecond counts the whole simulate() call (validation, forcing expansion, sun track, hour loop, totals).
 */
import { simulate } from '../../shared/melt/simulate';
import { prepareRun } from '../../shared/melt/prepare';
import { buildSunTrack } from '../../shared/melt/sun-track';
import { runHours } from '../../shared/melt/engine-loop';
import { allocateResult } from '../../shared/melt/result';
import { inventedValley } from '../../shared/melt/fixtures/invented-valley';
import { loadavg } from 'node:os';
import { simulateNaive } from './naive-engine';
import { solarPosition } from '../../shared/melt/solar-position';

const BANDS = 30;
const YEARS = 10;

function seconds(start: number): number {
  return (performance.now() - start) / 1000;
}

console.log(`load average before the runs (1, 5, 15 min): ${loadavg().map((x) => x.toFixed(2)).join(', ')} on this machine`);
const input = inventedValley({ bandCount: BANDS, years: YEARS, timeStep: 'hourly' });
const warmUp = inventedValley({ bandCount: BANDS, years: 1, timeStep: 'hourly' });
simulate(warmUp);
simulateNaive(warmUp);

// The machine is shared, so the engine runs RUNS times and the median counts; the best is shown too.
const RUNS = 5;
const times: number[] = [];
const cpuTimes: number[] = [];
let result = simulate(warmUp);
for (let i = 0; i < RUNS; i++) {
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  result = simulate(input);
  const cpu = process.cpuUsage(cpu0);
  times.push(seconds(t0));
  cpuTimes.push((cpu.user + cpu.system) / 1e6);
}
// CPU time is shown beside wall time because other work on the machine slows the wall clock.
const cpuMedian = [...cpuTimes].sort((a, b) => a - b)[Math.floor(RUNS / 2)];
const sorted = [...times].sort((a, b) => a - b);
console.log(`simulate() wall times, s: ${times.map((t) => t.toFixed(3)).join(' ')}; CPU times, s: ${cpuTimes.map((t) => t.toFixed(3)).join(' ')}`);
const total = sorted[Math.floor(RUNS / 2)];
const best = sorted[0];
const bandHours = result.bandCount * result.dayCount * 24;

let start = performance.now();

const run = prepareRun(input);
const prepare = seconds(start);
start = performance.now();
const sun = buildSunTrack(run.timeline, run.input.catchment.latitudeDeg, run.input.catchment.longitudeDeg, run.params.transmissivity);
const sunTime = seconds(start);
const scratch = allocateResult('energy-balance', 'bench', run.timeline.startDate, run.timeline.dayCount, result.bands);
start = performance.now();
runHours(run, sun, 'energy-balance', scratch);
const loop = seconds(start);
const heapMB = process.memoryUsage().heapUsed / 1e6; // with one input, two results and the prepared run alive

start = performance.now();
const naive = simulateNaive(input);
const naiveTime = seconds(start);

// How much of the naive time is its first habit alone: one sun position per band-hour.
start = performance.now();
let zenithSum = 0;
for (let h = 0; h < result.dayCount * 24; h++) {
  const instant = run.timeline.dayStartUtcMs[Math.floor(h / 24)] + ((h % 24) + 0.5) * 3_600_000;
  for (let b = 0; b < result.bandCount; b++) zenithSum += solarPosition(new Date(instant), run.input.catchment.latitudeDeg, run.input.catchment.longitudeDeg).zenithDeg;
}
const sunPerBandHour = seconds(start);

let maxDifference = 0;
naive.forEach((bands, d) => bands.forEach((t, b) => {
  const i = b * result.dayCount + d;
  const f = result.bandDay;
  const pairs = [
    [t.snowMelt, f.snowMeltMm[i]], [t.iceMelt, f.iceMeltMm[i]], [t.debrisMelt, f.debrisIceMeltMm[i]], [t.swe, f.sweMm[i]],
    [t.swAbs / 24, f.absorbedShortwaveWm2[i]], [t.cover > 0 ? t.lwNet / t.cover : 0, f.netLongwaveWm2[i]],
    [t.swIn > 0 ? t.albedoSum / t.swIn : 0, f.albedo[i]],
  ];
  for (const [a, c] of pairs) maxDifference = Math.max(maxDifference, Math.abs(a - c));
}));
if (maxDifference > 1e-6) throw new Error(`the naive version disagrees with the engine by ${maxDifference}; the comparison would mean nothing`);

const fmt = (x: number) => x.toLocaleString('en-US', { maximumFractionDigits: 0 });
console.log(`catchment: ${BANDS} bands × ${result.dayCount} days hourly = ${fmt(bandHours)} band-hours`);
console.log(`simulate(), median of ${RUNS}: ${total.toFixed(3)} s → ${fmt(bandHours / total)} band-hours/s (best ${best.toFixed(3)} s → ${fmt(bandHours / best)}); per CPU second (median): ${fmt(bandHours / cpuMedian)}`);
console.log(`  one more run in parts — validation + forcing expansion + tables: ${prepare.toFixed(3)} s; sun track (${fmt(result.dayCount * 24)} positions): ${sunTime.toFixed(3)} s`);
console.log(`  hour loop alone: ${loop.toFixed(3)} s → ${fmt(bandHours / loop)} band-hours/s`);
console.log(`naive version: ${naiveTime.toFixed(3)} s → ${fmt(bandHours / naiveTime)} band-hours/s; largest difference from the engine ${maxDifference.toExponential(1)} (mm w.e., W m⁻², albedo)`);
console.log(`  of which one sun position per band-hour alone takes ${sunPerBandHour.toFixed(3)} s (checksum ${zenithSum.toFixed(0)})`);
console.log(`naive / engine (median) time ratio: ${(naiveTime / total).toFixed(1)}×; heap in use after the engine runs: ${heapMB.toFixed(0)} MB`);
console.log(JSON.stringify({ bandHoursPerSecond: Math.round(bandHours / total), naiveRatio: Number((naiveTime / total).toFixed(2)), heapMB: Number(heapMB.toFixed(1)) }));
