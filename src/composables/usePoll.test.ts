import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { effectScope } from 'vue';
import { usePoll } from './usePoll';

describe('usePoll', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('ticks every interval after the previous tick, until a tick says to stop', async () => {
    let ticks = 0;
    const scope = effectScope();
    const poll = scope.run(() => usePoll(async () => ++ticks < 3, 500))!;
    await poll.start();
    expect(ticks).toBe(0);
    await vi.advanceTimersByTimeAsync(500);
    expect(ticks).toBe(1);
    await vi.advanceTimersByTimeAsync(5000);
    expect(ticks).toBe(3);
    expect(poll.active.value).toBe(false);
    scope.stop();
  });

  it('stops when its scope is disposed, even with a tick under way, and aborts that tick', async () => {
    let ticks = 0;
    let finish!: (again: boolean) => void;
    let signal!: AbortSignal;
    const scope = effectScope();
    const poll = scope.run(() => usePoll((s) => {
      ticks += 1;
      signal = s;
      return new Promise<boolean>((resolve) => (finish = resolve));
    }, 500))!;
    void poll.start({ immediate: true });
    expect(ticks).toBe(1);
    scope.stop();
    expect(signal.aborted).toBe(true);
    finish(true);
    await vi.advanceTimersByTimeAsync(10_000);
    expect(ticks).toBe(1);
    expect(poll.active.value).toBe(false);
  });

  it('does not start again once its scope is gone', async () => {
    let ticks = 0;
    const scope = effectScope();
    const poll = scope.run(() => usePoll(async () => { ticks += 1; return true; }, 500))!;
    scope.stop();
    await poll.start({ immediate: true });
    await vi.advanceTimersByTimeAsync(5000);
    expect(ticks).toBe(0);
  });

  it('restarts cleanly: stop then start leaves one chain of ticks', async () => {
    let ticks = 0;
    const scope = effectScope();
    const poll = scope.run(() => usePoll(async () => { ticks += 1; return true; }, 500))!;
    await poll.start();
    await poll.start();
    await vi.advanceTimersByTimeAsync(1000);
    expect(ticks).toBe(2);
    scope.stop();
  });
});
