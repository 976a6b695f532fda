import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';

/** A free TCP port on loopback (asked of the system, then let go). */
async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise((resolve) => server.close(resolve));
  return port;
}

export interface TestRedis {
  port: number;
  /** SIGTERM (Redis writes its append-only file) and waits for the exit. */
  stop(): Promise<void>;
  /** Starts it again on the same port and data. */
  start(): Promise<void>;
  /** Stops it and removes its data. */
  remove(): Promise<void>;
}

/** A Redis of a test's own, as scripts/lib/prepare.sh starts one (loopback, append-only file on), so it can be restarted mid-test. */
export async function startTestRedis(): Promise<TestRedis> {
  const port = await freePort();
  const dir = mkdtempSync(path.join(tmpdir(), 'tarnish-redis-'));
  let child: ChildProcess | null = null;
  const start = async () => {
    child = spawn('redis-server', ['--bind', '127.0.0.1', '--port', String(port), '--dir', dir, '--appendonly', 'yes', '--appendfsync', 'everysec', '--save', ''], { stdio: 'ignore' });
    for (let i = 0; i < 100; i++) {
      const ok = await new Promise<boolean>((resolve) => {
        const probe = spawn('redis-cli', ['-h', '127.0.0.1', '-p', String(port), 'ping'], { stdio: ['ignore', 'pipe', 'ignore'] });
        let out = '';
        probe.stdout.on('data', (c: Buffer) => (out += c.toString()));
        probe.on('exit', () => resolve(out.includes('PONG')));
      });
      if (ok) return;
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`the test Redis on port ${port} did not answer`);
  };
  const stop = async () => {
    const running = child;
    if (!running || running.exitCode !== null) return;
    const exited = new Promise((resolve) => running.once('exit', resolve));
    running.kill('SIGTERM');
    await exited;
  };
  await start();
  return { port, start, stop, remove: async () => { await stop(); rmSync(dir, { recursive: true, force: true }); } };
}
