import { afterAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { createRedis } from '../../server/queue/connection';
import { RunProgress } from '../../server/queue/run-progress';

const config = loadConfig();
const redis = createRedis(config.queue);
const progress = new RunProgress(redis, `run-progress-test-${process.pid}`);
afterAll(() => redis.quit());

describe("a run's progress across members", () => {
  it('counts stored members whole and simulating ones by their fraction, whichever worker reports', async () => {
    const runId = 101;
    expect(await progress.report(runId, 0, 0.5, 4)).toBeCloseTo(0.125);
    expect(await progress.report(runId, 1, 0.25, 4)).toBeCloseTo(0.1875);
    // Member 0 stored; member 1 moved on; out-of-range fractions are held to 0 … 1.
    expect(await progress.report(runId, 0, 1, 4)).toBeCloseTo(0.3125);
    expect(await progress.report(runId, 1, 7, 4)).toBeCloseTo(0.5);
    expect(await progress.report(runId, 2, -1, 4)).toBeCloseTo(0.5);
    await progress.forget(runId);
    expect(await progress.report(runId, 3, 0.5, 4)).toBeCloseTo(0.125);
    await progress.forget(runId);
  });
});
