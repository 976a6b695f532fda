/**
 * npm run bench:geodata — a 2000 × 2000 DEM (30 m cells, 60 × 60 km) with catchment, glacier and
 * debris outlines to 30 bands of 100 m with horizons and sky view, in a worker thread of the
 * shared thread pool. Prints the wall time of the derivation (target: under 10 s on a 2-core
 * machine) and the longest stall of the main thread's event loop meanwhile.
 */
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { crsFromEpsg } from '../../shared/geodata/crs';
import { valueNoise } from '../../shared/geodata/demo/value-noise';
import type { DerivedInWorker, DeriveTask } from '../../server/services/geodata/derive-worker';
import type { Outline, Ring } from '../../shared/geodata/outline';
import type { Raster } from '../../shared/geodata/raster';
import { traceMask } from '../../shared/geodata/trace';
import { ThreadBudget } from '../../server/services/thread-budget';
import { ThreadPool } from '../../server/services/thread-pool';

const SIZE = 2000;
const CELL = 30;
const SECTORS = Number(process.env.SECTORS ?? 36);

function benchDem(): Raster {
  const ridges = valueNoise(11, 9000, 7);
  const values = new Float32Array(SIZE * SIZE);
  for (let r = 0; r < SIZE; r++) {
    for (let c = 0; c < SIZE; c++) {
      const x = c * CELL;
      const y = r * CELL;
      const dome = 1 - Math.hypot(c - SIZE / 2, r - SIZE / 2) / (SIZE * 0.75);
      values[r * SIZE + c] = 2900 + 3600 * dome + 900 * ridges(x, y);
    }
  }
  return { width: SIZE, height: SIZE, x0: 400_000, y0: 3_800_000, dx: CELL, dy: CELL, values, crs: crsFromEpsg(32644, 'dem') };
}

function ellipse(dem: Raster, fraction: number): Outline {
  const cx = dem.x0 + (SIZE * CELL) / 2;
  const cy = dem.y0 - (SIZE * CELL) / 2;
  const ring: Ring = Array.from({ length: 257 }, (_, k) => {
    const a = (2 * Math.PI * (k % 256)) / 256;
    const r = fraction * (SIZE * CELL) * 0.5 * (1 + 0.08 * Math.sin(5 * a));
    return [cx + r * Math.cos(a), cy + 0.8 * r * Math.sin(a)] as [number, number];
  });
  return { crs: dem.crs, polygons: [[ring]] };
}

function coverOutline(dem: Raster, above: (z: number, i: number) => boolean): Outline {
  const mask = Uint8Array.from(dem.values, (z, i) => (above(z, i) ? 1 : 0));
  return { crs: dem.crs, polygons: traceMask(mask, dem) };
}

const dem = benchDem();
const task: DeriveTask = {
  input: {
    dem,
    catchment: ellipse(dem, 0.9),
    glaciers: coverOutline(dem, (z) => z > 5300),
    debris: coverOutline(dem, (z, i) => z > 5300 && z < 5600 && (i % SIZE) % 50 < 25),
  },
  options: { bandWidthM: 100, horizonSectors: SECTORS, debrisThicknessM: 0.2 },
};
const pool = new ThreadPool<DeriveTask, DerivedInWorker>(new URL('../../server/services/geodata/derive-worker.ts', import.meta.url), new ThreadBudget(1), 'batch');
pool.warm();
await pool.run({ ...task, input: { ...task.input, dem: { ...dem, width: 50, height: 50, values: dem.values.subarray(0, 2500) } }, options: { ...task.options, horizonSectors: 8 } }).catch(() => undefined);
const stalls = monitorEventLoopDelay({ resolution: 10 });
stalls.enable();
const started = performance.now();
const result = await pool.run(task);
const seconds = (performance.now() - started) / 1000;
stalls.disable();
await pool.close();
console.log(`geodata: ${SIZE} × ${SIZE} DEM (${CELL} m) → ${result.bands.length} bands of 100 m, ${SECTORS} horizon sectors, sky view: ${seconds.toFixed(2)} s in a worker thread (target < 10 s)`);
console.log(`         catchment ${result.summary.areaKm2.toFixed(0)} km², glacier ${result.summary.glacierAreaKm2.toFixed(0)} km²; main-thread event loop stalled at most ${(stalls.max / 1e6).toFixed(1)} ms meanwhile`);
