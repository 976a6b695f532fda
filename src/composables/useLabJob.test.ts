import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { effectScope } from 'vue';
import { z } from 'zod';
import type { LabJob } from '@shared/schemas/lab';
import { labApi } from 'src/api/lab';
import { useLabJob } from './useLabJob';

vi.mock('src/api/lab', () => ({ labApi: { job: vi.fn(), jobs: vi.fn(), cancelJob: vi.fn() } }));

const running: LabJob = {
  id: 7, catchmentId: 1, kind: 'sweep', status: 'running', progress: 0.2, message: '', error: null, result: null,
  createdBy: 'A scientist', createdAt: '2026-01-01T00:00:00.000Z', finishedAt: null,
};

describe('useLabJob', () => {
  beforeEach(() => {
    vi.useFakeTimers();
    vi.mocked(labApi.job).mockReset().mockResolvedValue(running);
  });
  afterEach(() => vi.useRealTimers());

  it('polls a running job and stops once it is done, keeping the parsed result', async () => {
    const scope = effectScope();
    const lab = scope.run(() => useLabJob({ resultSchema: z.object({ cells: z.number() }) }))!;
    await lab.start(async () => running);
    await vi.advanceTimersByTimeAsync(1600);
    expect(vi.mocked(labApi.job).mock.calls.length).toBe(3);
    vi.mocked(labApi.job).mockResolvedValue({ ...running, status: 'done', progress: 1, result: { cells: 400 } });
    await vi.advanceTimersByTimeAsync(5000);
    expect(vi.mocked(labApi.job).mock.calls.length).toBe(4);
    expect(lab.result.value).toEqual({ cells: 400 });
    scope.stop();
  });

  it('stops polling when its component is gone, even though the job still runs', async () => {
    const scope = effectScope();
    const lab = scope.run(() => useLabJob({ resultSchema: z.unknown() }))!;
    await lab.start(async () => running);
    await vi.advanceTimersByTimeAsync(1100);
    const before = vi.mocked(labApi.job).mock.calls.length;
    expect(before).toBeGreaterThan(0);
    scope.stop();
    await vi.advanceTimersByTimeAsync(10_000);
    expect(vi.mocked(labApi.job).mock.calls.length).toBe(before);
  });

  it('does not start polling when the component goes while the job is being started', async () => {
    const scope = effectScope();
    const lab = scope.run(() => useLabJob({ resultSchema: z.unknown() }))!;
    let begun!: (job: LabJob) => void;
    const starting = lab.start(() => new Promise<LabJob>((resolve) => (begun = resolve)));
    scope.stop();
    begun(running);
    await starting;
    await vi.advanceTimersByTimeAsync(10_000);
    expect(labApi.job).not.toHaveBeenCalled();
  });
});
