import { describe, expect, it } from 'vitest';
import { BackgroundWork } from './background-work';

const until = (signal: AbortSignal, ended: string[], key: string) => new Promise<void>((resolve) => {
  signal.addEventListener('abort', () => {
    ended.push(`${key}: ${(signal.reason as Error).message}`);
    resolve();
  });
});

describe('work beside the answers', () => {
  it('aborts one piece of work by its key, waits for all, and stops what is left at a deadline with the reason', async () => {
    const work = new BackgroundWork<string>();
    const ended: string[] = [];
    work.run('quick', async () => { ended.push('quick: done'); });
    work.run('cancelled', (signal) => until(signal, ended, 'cancelled'));
    work.run('slow', (signal) => until(signal, ended, 'slow'));
    expect(await work.abort('cancelled', new Error('Cancelled.'))).toBe(true);
    expect(await work.abort('nothing', new Error('Cancelled.'))).toBe(false);
    await work.stop(20, new Error('Shutting down.'));
    expect(ended).toEqual(['quick: done', 'cancelled: Cancelled.', 'slow: Shutting down.']);
    await work.idle();
  });
});
