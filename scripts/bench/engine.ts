/**
 * Benchmark of the melt engine: an invented 30-band catchment, 10 years hourly (≈ 2.6 M band-hours,
 * plus the repeated first year the spin-up adds), run by the engine and, in the same process, by
 * the naive version of the same physics (scripts/bench/naive-engine.ts). Prints the figures; the
 * last line is one JSON object:
 *   {"bandHoursPerSecond": …, "perCpuSecond": …, "naiveRatio": …, "heapMB": …}
 * bandHoursPerSecond counts the period's band-hours over the whole simulate() call (validation,
 * forcing expansion, sun and sky, spin-up, hour loop, totals). The machine may be shared, so
 * perCpuSecond and naiveRatio are taken from CPU time (medians), which other work on the
 * machine disturbs far less than the wall clock.
 */
import { loadavg } from 'node:os';
import { simulate } from '../../shared/melt/simulate';
import { prepareRun } from '../../shared/melt/prepare';
import { buildSunTrack } from '../../shared/melt/sun-track';
import { buildShortwaveForcing } from '../../shared/melt/shortwave-forcing';
import { buildLoopContext } from '../../shared/melt/loop-context';
import { runSegments } from '../../shared/melt/engine-loop';
import { allocateResult } from '../../shared/melt/result';
import { inventedValley } from '../../shared/melt/fixtures/invented-valley';
import { simulateNaive } from './naive-engine';

const BANDS = 30;
const YEARS = 10;
const RUNS = 5;
const NAIVE_RUNS = 3;

const seconds = (start: number) => (performance.now() - start) / 1000;
const cpuSeconds = (start: NodeJS.CpuUsage) => {
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1e6;
};
const fmt = (x: number) => x.toLocaleString('en-US', { maximumFractionDigits: 0 });
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

console.log(`load average before the runs (1, 5, 15 min): ${loadavg().map((x) => x.toFixed(2)).join(', ')} on this machine`);
const input = inventedValley({ bandCount: BANDS, years: YEARS, timeStep: 'hourly' });
const warmUp = inventedValley({ bandCount: BANDS, years: 1, timeStep: 'hourly' });
simulate(warmUp);
simulateNaive(warmUp);

// The machine is shared, so the engine runs RUNS times and the median counts; CPU time is shown
// beside wall time because other work on the machine slows the wall clock.
const times: number[] = [];
const cpuTimes: number[] = [];
let result = simulate(warmUp);
for (let i = 0; i < RUNS; i++) {
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  result = simulate(input);
  cpuTimes.push(cpuSeconds(cpu0));
  times.push(seconds(t0));
}
const bandHours = result.bandCount * result.dayCount * 24;
const total = median(times);
console.log(`simulate() wall times, s: ${times.map((t) => t.toFixed(3)).join(' ')}; CPU times, s: ${cpuTimes.map((t) => t.toFixed(3)).join(' ')}`);

let start = process.cpuUsage();
const run = prepareRun(input);
const prepare = cpuSeconds(start);
start = process.cpuUsage();
const sun = buildSunTrack(run.timeline, run.input.catchment.latitudeDeg, run.input.catchment.longitudeDeg);
const shortwave = buildShortwaveForcing(run.timeline, sun, run.forcing, run.params, run.stationPressurePa, run.input.shortwaveSource);
const sky = cpuSeconds(start);
const context = buildLoopContext(run, sun, shortwave, 'energy-balance');
const scratch = allocateResult('energy-balance', 'bench', run.recordStartDate, run.recordDays, result.bands, { start: run.startReport, shortwaveSource: shortwave.source });
start = process.cpuUsage();
runSegments(context, scratch);
const loop = cpuSeconds(start);
const simulatedBandHours = run.segments.reduce((n, s) => n + s.lastDay - s.firstDay + 1, 0) * 24 * BANDS;
const heapMB = process.memoryUsage().heapUsed / 1e6;

const naiveTimes: number[] = [];
const naiveCpuTimes: number[] = [];
for (let i = 0; i < NAIVE_RUNS; i++) {
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  simulateNaive(input);
  naiveCpuTimes.push(cpuSeconds(cpu0));
  naiveTimes.push(seconds(t0));
}
const naiveRatio = median(naiveCpuTimes) / median(cpuTimes);

console.log(`catchment: ${BANDS} bands × ${result.dayCount} days hourly = ${fmt(bandHours)} band-hours (${fmt(simulatedBandHours)} simulated with the spin-up)`);
console.log(`simulate(), median of ${RUNS}: ${total.toFixed(3)} s → ${fmt(bandHours / total)} band-hours/s; per CPU second (median): ${fmt(bandHours / median(cpuTimes))}`);
console.log(`  one more run in parts, CPU time — validation + forcing expansion + tables: ${prepare.toFixed(3)} s; sun and sky (${fmt(run.timeline.dayCount * 24)} hours): ${sky.toFixed(3)} s`);
console.log(`  hour loop alone: ${loop.toFixed(3)} s → ${fmt(simulatedBandHours / loop)} simulated band-hours/s (${(1e9 * loop / simulatedBandHours).toFixed(0)} ns each)`);
console.log(`naive version, median of ${NAIVE_RUNS}: ${median(naiveTimes).toFixed(3)} s; CPU ${median(naiveCpuTimes).toFixed(3)} s → ${fmt(bandHours / median(naiveCpuTimes))} band-hours per CPU second; naive / engine CPU time ratio ${naiveRatio.toFixed(1)}×`);
console.log(`heap in use after the engine runs: ${heapMB.toFixed(0)} MB`);
console.log(`load average after the runs (1, 5, 15 min): ${loadavg().map((x) => x.toFixed(2)).join(', ')}`);
console.log(JSON.stringify({
  bandHoursPerSecond: Math.round(bandHours / total), perCpuSecond: Math.round(bandHours / median(cpuTimes)),
  naiveRatio: Number(naiveRatio.toFixed(2)), heapMB: Number(heapMB.toFixed(1)),
}));
