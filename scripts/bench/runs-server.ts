/**
 * The API for bench:runs in a process of its own, so the benchmark's client does not share its
 * event loop. Prints {"port": …} once listening; on SIGTERM prints how long its event loop was
 * held up ({"loopP99Ms", "loopMaxMs", "busyShare", "cpuMs"}) and exits. Does not touch other runs.
 */
import type { AddressInfo } from 'node:net';
import { monitorEventLoopDelay, performance } from 'node:perf_hooks';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createContext } from '../../server/context';
import { createDb } from '../../server/db';

const config = loadConfig();
const db = createDb(config.db);
const ctx = createContext(config, db);
const server = createApp(ctx).listen(0, '127.0.0.1');
await new Promise<void>((resolve) => server.once('listening', () => resolve()));

const loopDelay = monitorEventLoopDelay({ resolution: 10 });
loopDelay.enable();
const utilisationAtStart = performance.eventLoopUtilization();
const cpuAtStart = process.cpuUsage();
console.log(JSON.stringify({ port: (server.address() as AddressInfo).port, workers: (await ctx.queues.health()).workers }));

process.once('SIGTERM', () => {
  loopDelay.disable();
  console.log(JSON.stringify({
    loopP99Ms: loopDelay.percentile(99) / 1e6,
    loopMaxMs: loopDelay.max / 1e6,
    busyShare: performance.eventLoopUtilization(utilisationAtStart).utilization,
    // CPU time of the whole process (all threads) since listening: a figure other work on the machine barely moves.
    cpuMs: (({ user, system }) => (user + system) / 1000)(process.cpuUsage(cpuAtStart)),
  }));
  server.close();
  void ctx.close().then(() => db.destroy()).then(() => process.exit(0));
});
