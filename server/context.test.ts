import { availableParallelism } from 'node:os';
import { afterAll, describe, expect, it } from 'vitest';
import { parseConfig } from './config';
import { createContext } from './context';
import { createDb } from './db';

// The database is never reached here: Knex connects on the first query.
const config = parseConfig({ NODE_ENV: 'test', WORKER_THREADS: '2' });
const db = createDb(config.db);
afterAll(() => db.destroy());

describe('the composition root', () => {
  it('reads one worker-thread budget from WORKER_THREADS, one fewer than the cores by default', () => {
    expect(config.workerThreads).toBe(2);
    expect(parseConfig({ NODE_ENV: 'test' }).workerThreads).toBe(Math.max(1, availableParallelism() - 1));
    expect(() => parseConfig({ NODE_ENV: 'test', WORKER_THREADS: '-1' })).toThrow(/WORKER_THREADS/);
  });

  it('gives the PDF, upload and geodata pools that one budget, so together they never use more threads', async () => {
    const ctx = createContext(config, db, { bcryptCost: 4 });
    expect(ctx.threads.threads).toBe(2);
    for (const pool of [ctx.pdfPool, ctx.uploads.pool, ctx.geodata.pool]) expect(pool.budget).toBe(ctx.threads);
    await ctx.close();
  });
});
