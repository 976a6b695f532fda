import { describe, expect, it } from 'vitest';
import { SignInBackoff } from './sign-in-limits';

describe('the sign-in back-off', () => {
  const clock = { t: 0 };
  const backoff = () => new SignInBackoff({ freeFailures: 5, baseDelayMs: 1000, maxDelayMs: 30_000 }, () => clock.t);

  it('lets the first failures through without waiting', () => {
    const b = backoff();
    for (let i = 0; i < 4; i++) b.failed('a');
    expect(b.waitFor('a')).toBe(0);
  });

  it('doubles the wait with every failure past the free ones, up to the maximum', () => {
    const b = backoff();
    const waits: number[] = [];
    for (let i = 0; i < 12; i++) {
      b.failed('a');
      waits.push(b.waitFor('a'));
    }
    expect(waits).toEqual([0, 0, 0, 0, 1000, 2000, 4000, 8000, 16_000, 30_000, 30_000, 30_000]);
  });

  it('ends the wait once the delay has passed, and forgets the account after a success', () => {
    const b = backoff();
    for (let i = 0; i < 6; i++) b.failed('a');
    expect(b.waitFor('a')).toBe(2000);
    clock.t += 2000;
    expect(b.waitFor('a')).toBe(0);
    b.succeeded('a');
    b.failed('a');
    expect(b.waitFor('a')).toBe(0);
    expect(b.waitFor('b')).toBe(0);
  });
});
