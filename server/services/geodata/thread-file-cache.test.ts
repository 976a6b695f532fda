import { describe, expect, it } from 'vitest';
import { cachedRead } from './thread-file-cache';

describe('files kept by a worker thread', () => {
  it('reads a file once while it is used, keeps the three used last, and never keeps a failed read', async () => {
    let reads = 0;
    const read = (value: string) => () => { reads++; return Promise.resolve(value); };
    expect(await cachedRead('dem', read('a'))).toBe('a');
    expect(await cachedRead('dem', read('other'))).toBe('a');
    expect(reads).toBe(1);
    await cachedRead('glaciers', read('g'));
    await cachedRead('debris', read('d'));
    await cachedRead('second dem', read('b'));
    // "dem" was used longest ago: it is read again.
    expect(await cachedRead('dem', read('a again'))).toBe('a again');
    expect(reads).toBe(5);
    await expect(cachedRead('broken', () => Promise.reject(new Error('cut short')))).rejects.toThrow('cut short');
    expect(await cachedRead('broken', read('whole'))).toBe('whole');
  });
});
