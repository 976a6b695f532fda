import { spawn } from 'node:child_process';
import { createInterface } from 'node:readline';

/**
 * Starts scripts/bench/runs-server.ts (the API in a process of its own, so a benchmark's client
 * does not share its event loop) and reads the JSON lines it prints: the port once listening,
 * the event-loop report once stopped. BENCH_PROFILE_DIR writes a CPU profile of the API.
 */
export async function startApiProcess() {
  const profile = process.env.BENCH_PROFILE_DIR ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_PROFILE_DIR}`] : [];
  // The API logs every request, as in production, to a file (its standard output carries the lines read here).
  const env = { ...process.env, LOG_FILE: process.env.LOG_FILE ?? '/dev/null', LOG_LEVEL: process.env.LOG_LEVEL ?? 'info' };
  const child = spawn(process.execPath, ['--import', 'tsx', ...profile, 'scripts/bench/runs-server.ts'], { stdio: ['ignore', 'pipe', 'inherit'], env });
  const lines = createInterface({ input: child.stdout });
  const next = () => new Promise<Record<string, number>>((resolve, reject) => {
    lines.once('line', (line) => resolve(JSON.parse(line)));
    child.once('exit', (code) => reject(new Error(`the API process exited (${code})`)));
  });
  const { port, threads } = await next();
  // Stopping twice (once measured, once in a clean-up) gets the one report.
  let stopping: Promise<Record<string, number>> | null = null;
  const stop = () => (stopping ??= (() => { const report = next(); child.kill('SIGTERM'); return report; })());
  return { port, threads, stop };
}
